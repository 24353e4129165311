using EventReview.Data.Auth;
using Microsoft.EntityFrameworkCore;
using Microsoft.EntityFrameworkCore.Metadata.Builders;

namespace EventReview.Data.Configurations;

public sealed class SignatureRequestConfiguration : IEntityTypeConfiguration<SignatureRequest>
{
    public void Configure(EntityTypeBuilder<SignatureRequest> b)
    {
        b.ToTable("SignatureRequests");
        b.HasKey(r => r.Id);
        b.HasIndex(r => r.CreatedAt);
        b.Property(r => r.Id).HasMaxLength(32);
        b.Property(r => r.UserId).HasMaxLength(64);
        b.Property(r => r.ItemKey).HasMaxLength(64);
        b.Property(r => r.Meaning).HasConversion<string>().HasMaxLength(32);
        b.Property(r => r.Statement).HasMaxLength(4000);
        b.Property(r => r.SeenFingerprint).HasMaxLength(64);
        b.Property(r => r.Outcome).HasMaxLength(500);
    }
}
