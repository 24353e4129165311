using EventReview.Core.Cases;
using Microsoft.EntityFrameworkCore;
using Microsoft.EntityFrameworkCore.Metadata.Builders;

namespace EventReview.Data.Configurations;

public sealed class TimelineEntryConfiguration : IEntityTypeConfiguration<TimelineEntry>
{
    public void Configure(EntityTypeBuilder<TimelineEntry> b)
    {
        b.ToTable("Timeline");
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
