using EventReview.Core.Evidence;
using Microsoft.EntityFrameworkCore;
using Microsoft.EntityFrameworkCore.Metadata.Builders;

namespace EventReview.Data.Configurations;

public sealed class ComputationRecordConfiguration : IEntityTypeConfiguration<ComputationRecord>
{
    public void Configure(EntityTypeBuilder<ComputationRecord> b)
    {
        b.ToTable("Computations");
        b.HasKey(c => c.Id);
        b.Property(c => c.Kind).HasMaxLength(32).IsRequired();
        b.Property(c => c.InputFingerprint).HasMaxLength(64);
        b.Property(c => c.ToolVersion).HasMaxLength(64);
        b.Property(c => c.Verdict).HasMaxLength(32);
        b.Property(c => c.Summary).HasMaxLength(1000);
        b.Property(c => c.RunBy).HasMaxLength(64);
        b.Property(c => c.RunByName).HasMaxLength(200);
        b.Ignore(c => c.ContentSha256);
    }
}
