using EventReview.Core.Evidence;
using Microsoft.EntityFrameworkCore;
using Microsoft.EntityFrameworkCore.Metadata.Builders;

namespace EventReview.Data.Configurations;

public sealed class EvidenceItemConfiguration : IEntityTypeConfiguration<EvidenceItem>
{
    public void Configure(EntityTypeBuilder<EvidenceItem> b)
    {
        b.ToTable("Evidence");
        b.HasKey(e => e.Id);
        b.Property(e => e.Kind).HasConversion<string>().HasMaxLength(32);
        b.Property(e => e.ContentSha256).HasMaxLength(64).IsRequired();
        b.Property(e => e.FileName).HasMaxLength(255);
        b.Property(e => e.ContentType).HasMaxLength(200);
        b.Property(e => e.Url).HasMaxLength(2000);
        b.Property(e => e.AddedBy).HasMaxLength(64);
        b.Property(e => e.AddedByName).HasMaxLength(200);
        b.Property(e => e.Role).HasMaxLength(EventReview.Core.Evidence.Roles.FileRole.MaxWordLength);
        b.Ignore(e => e.FileRole);
    }
}
