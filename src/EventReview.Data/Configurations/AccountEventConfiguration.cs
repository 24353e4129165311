using EventReview.Data.Auth;
using Microsoft.EntityFrameworkCore;
using Microsoft.EntityFrameworkCore.Metadata.Builders;

namespace EventReview.Data.Configurations;

public sealed class AccountEventConfiguration : IEntityTypeConfiguration<AccountEvent>
{
    public void Configure(EntityTypeBuilder<AccountEvent> b)
    {
        b.ToTable("AccountEvents");
        b.HasKey(e => e.Id);
        b.HasIndex(e => e.Sequence).IsUnique();
        b.Property(e => e.Kind).HasMaxLength(32);
        b.Property(e => e.UserId).HasMaxLength(64);
        b.Property(e => e.Account).HasMaxLength(AccountEvent.MaxAccountLength);
        b.Property(e => e.Address).HasMaxLength(64);
        b.Property(e => e.Detail).HasMaxLength(300);
        b.Property(e => e.PreviousHash).HasMaxLength(64);
        b.Property(e => e.Hash).HasMaxLength(64);
        b.Property(e => e.KeyId).HasMaxLength(64);
        b.Property(e => e.Mac).HasMaxLength(64);
    }
}
