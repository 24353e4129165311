using EventReview.Core.Evidence;
using Microsoft.EntityFrameworkCore;
using Microsoft.EntityFrameworkCore.Metadata.Builders;

namespace EventReview.Data.Configurations;

public sealed class SignOffConfiguration : IEntityTypeConfiguration<SignOff>
{
    public void Configure(EntityTypeBuilder<SignOff> b)
    {
        b.ToTable("SignOffs");
        b.HasKey(s => s.Id);
        b.Property(s => s.UserId).HasMaxLength(64);
        b.Property(s => s.SignerName).HasMaxLength(200);
        b.Property(s => s.Meaning).HasConversion<string>().HasMaxLength(32);
        b.Property(s => s.Statement).HasMaxLength(4000);
        b.Property(s => s.EvidenceFingerprint).HasMaxLength(64);
        b.Ignore(s => s.SignedAtGps);
    }
}
