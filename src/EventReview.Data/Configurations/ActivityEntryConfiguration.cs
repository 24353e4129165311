using EventReview.Core.Cases;
using Microsoft.EntityFrameworkCore;
using Microsoft.EntityFrameworkCore.Metadata.Builders;

namespace EventReview.Data.Configurations;

public sealed class ActivityEntryConfiguration : IEntityTypeConfiguration<ActivityEntry>
{
    public void Configure(EntityTypeBuilder<ActivityEntry> b)
    {
        b.ToTable("Activity");
        b.HasKey(a => a.Id);
        b.HasIndex(a => new { a.ReviewCaseId, a.Sequence }).IsUnique();
        b.Property(a => a.CandidateId).HasMaxLength(128);
        b.Property(a => a.ActorId).HasMaxLength(64);
        b.Property(a => a.ActorName).HasMaxLength(200);
        b.Property(a => a.Kind).HasMaxLength(64);
        b.Property(a => a.ItemKey).HasMaxLength(64);
        b.Property(a => a.PreviousHash).HasMaxLength(64);
        b.Property(a => a.Hash).HasMaxLength(64);
        b.Property(a => a.KeyId).HasMaxLength(64);
        b.Property(a => a.Mac).HasMaxLength(64);
        b.Ignore(a => a.Chain);
    }
}
