using EventReview.Data.Notifications;
using Microsoft.EntityFrameworkCore;
using Microsoft.EntityFrameworkCore.Metadata.Builders;

namespace EventReview.Data.Configurations;

public sealed class OutboxMessageConfiguration : IEntityTypeConfiguration<OutboxMessage>
{
    public void Configure(EntityTypeBuilder<OutboxMessage> b)
    {
        b.ToTable("OutboxMessages");
        b.HasKey(m => m.Id);
        b.HasIndex(m => new { m.SentAt, m.GaveUpAt, m.NextAttemptAt });
        b.HasIndex(m => new { m.UserId, m.CreatedAt });
        b.Property(m => m.UserId).HasMaxLength(64);
        b.Property(m => m.Channel).HasMaxLength(16);
        b.Property(m => m.Target).HasMaxLength(NotificationSettings.MaxUrlLength);
        b.Property(m => m.Kind).HasMaxLength(32);
        b.Property(m => m.Subject).HasMaxLength(200);
        b.Property(m => m.LastError).HasMaxLength(500);
        b.Ignore(m => m.Status);
    }
}
