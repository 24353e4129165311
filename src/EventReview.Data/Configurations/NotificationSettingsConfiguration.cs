using EventReview.Data.Notifications;
using Microsoft.EntityFrameworkCore;
using Microsoft.EntityFrameworkCore.Metadata.Builders;

namespace EventReview.Data.Configurations;

public sealed class NotificationSettingsConfiguration : IEntityTypeConfiguration<NotificationSettings>
{
    public void Configure(EntityTypeBuilder<NotificationSettings> b)
    {
        b.ToTable("NotificationSettings");
        b.HasKey(s => s.UserId);
        b.Property(s => s.UserId).HasMaxLength(64);
        b.Property(s => s.Events).HasConversion<int>();
        b.Property(s => s.WebhookUrl).HasMaxLength(NotificationSettings.MaxUrlLength);
        b.Property(s => s.WebhookSecret).HasMaxLength(100);
    }
}
