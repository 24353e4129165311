using EventReview.Core.Injections;
using Microsoft.EntityFrameworkCore;
using Microsoft.EntityFrameworkCore.Metadata.Builders;

namespace EventReview.Data.Configurations;

public sealed class SealedInjectionRecordConfiguration : IEntityTypeConfiguration<SealedInjectionRecord>
{
    public void Configure(EntityTypeBuilder<SealedInjectionRecord> b)
    {
        b.ToTable("SealedInjectionRecords");
        b.HasKey(s => s.Id);
        b.HasIndex(s => s.Commitment).IsUnique();
        b.Property(s => s.Commitment).HasMaxLength(64).IsRequired();
        b.Property(s => s.Label).HasMaxLength(200).IsRequired();
        b.Property(s => s.SealedById).HasMaxLength(64);
        b.Property(s => s.SealedByName).HasMaxLength(200);
        b.Property(s => s.OpenedById).HasMaxLength(64);
        b.Property(s => s.OpenedByName).HasMaxLength(200);
        b.Property(s => s.OpenedSummary).HasMaxLength(1000);
        b.Property(s => s.OpenedSalt).HasMaxLength(256);
        b.Property(s => s.OpenedAt).IsConcurrencyToken(); // two coordinators opening at once: the second save fails
        b.Ignore(s => s.IsOpened);
    }
}
