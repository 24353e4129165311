using EventReview.Data.Notifications;
using Microsoft.EntityFrameworkCore;
using Microsoft.EntityFrameworkCore.Metadata.Builders;

namespace EventReview.Data.Configurations;

public sealed class NotificationConfiguration : IEntityTypeConfiguration<Notification>
{
    public void Configure(EntityTypeBuilder<Notification> b)
    {
        b.ToTable("Notifications");
        b.HasKey(n => n.Id);
        b.HasIndex(n => n.DedupKey).IsUnique();
        b.HasIndex(n => new { n.UserId, n.CreatedAt });
        b.HasIndex(n => n.RoutedAt);
        b.Property(n => n.UserId).HasMaxLength(64);
        b.Property(n => n.Kind).HasMaxLength(32);
        b.Property(n => n.ItemKey).HasMaxLength(64);
        b.Property(n => n.Subject).HasMaxLength(200);
        b.Property(n => n.Text).HasMaxLength(2000);
        b.Property(n => n.Link).HasMaxLength(300);
        b.Property(n => n.DedupKey).HasMaxLength(200);
        b.Property(n => n.Route).HasMaxLength(32).IsConcurrencyToken();

        // Two app instances routing the same notification: the second save finds it changed and is refused.
        b.Property(n => n.RoutedAt).IsConcurrencyToken();
    }
}
