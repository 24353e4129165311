using EventReview.Core.Network;
using Microsoft.EntityFrameworkCore;
using Microsoft.EntityFrameworkCore.Metadata.Builders;

namespace EventReview.Data.Configurations;

public sealed class SiteConfiguration : IEntityTypeConfiguration<Site>
{
    public void Configure(EntityTypeBuilder<Site> b)
    {
        b.ToTable("Sites");
        b.HasKey(s => s.Id);
        b.HasIndex(s => s.Code).IsUnique();
        b.Property(s => s.Code).HasMaxLength(8).IsRequired();
        b.Property(s => s.Name).HasMaxLength(200).IsRequired();
    }
}
