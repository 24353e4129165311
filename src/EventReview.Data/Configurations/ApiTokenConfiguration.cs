using EventReview.Data.Auth;
using Microsoft.EntityFrameworkCore;
using Microsoft.EntityFrameworkCore.Metadata.Builders;

namespace EventReview.Data.Configurations;

public sealed class ApiTokenConfiguration : IEntityTypeConfiguration<ApiToken>
{
    public void Configure(EntityTypeBuilder<ApiToken> b)
    {
        b.ToTable("ApiTokens");
        b.HasKey(t => t.Id);
        b.HasIndex(t => t.Hash).IsUnique();
        b.Property(t => t.Name).HasMaxLength(100);
        b.Property(t => t.Hash).HasMaxLength(64);
        b.Property(t => t.Role).HasMaxLength(32);
        b.Property(t => t.CreatedBy).HasMaxLength(200);
        b.Property(t => t.Scopes).HasMaxLength(200);
        b.Ignore(t => t.IsActive);
        b.Ignore(t => t.ScopeList);
    }
}
