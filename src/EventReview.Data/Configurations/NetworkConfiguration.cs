using EventReview.Core.Network;
using Microsoft.EntityFrameworkCore;
using Microsoft.EntityFrameworkCore.Metadata.Builders;

namespace EventReview.Data.Configurations;

public sealed class NetworkConfiguration : IEntityTypeConfiguration<DetectorNetwork>
{
    public void Configure(EntityTypeBuilder<DetectorNetwork> b)
    {
        b.ToTable("Networks");
        b.HasKey(n => n.Id);
        b.Property(n => n.Name).HasMaxLength(200).IsRequired();
        b.HasMany(n => n.Sites).WithOne().HasForeignKey("NetworkId").OnDelete(DeleteBehavior.Cascade);
        b.Navigation(n => n.Sites).UsePropertyAccessMode(PropertyAccessMode.Field);
    }
}
