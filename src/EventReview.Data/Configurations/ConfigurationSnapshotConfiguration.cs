using EventReview.Core.Configuration;
using Microsoft.EntityFrameworkCore;
using Microsoft.EntityFrameworkCore.Metadata.Builders;

namespace EventReview.Data.Configurations;

public sealed class ConfigurationSnapshotConfiguration : IEntityTypeConfiguration<ConfigurationSnapshot>
{
    public void Configure(EntityTypeBuilder<ConfigurationSnapshot> b)
    {
        b.ToTable("ConfigurationSnapshots");
        b.HasKey(s => s.Id);
        b.HasIndex(s => new { s.SiteCode, s.CapturedAt });
        b.HasIndex(s => s.ReviewCaseId);
        b.Property(s => s.SiteCode).HasMaxLength(8).IsRequired();
        b.Property(s => s.Label).HasMaxLength(200);
        b.Property(s => s.CapturedBy).HasMaxLength(64);
        b.Property(s => s.CapturedByName).HasMaxLength(200);
        b.Property(s => s.FrozenBy).HasMaxLength(64);
        b.Property(s => s.FrozenByName).HasMaxLength(200);
        b.Property(s => s.FreezeReason).HasMaxLength(2000);
        b.Property(s => s.Fingerprint).HasMaxLength(64);
        b.Ignore(s => s.Items);
        b.HasOne<Core.Cases.ReviewCase>().WithMany().HasForeignKey(s => s.ReviewCaseId).OnDelete(DeleteBehavior.Restrict);
    }
}
