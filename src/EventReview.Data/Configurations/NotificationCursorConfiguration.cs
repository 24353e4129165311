using EventReview.Data.Notifications;
using Microsoft.EntityFrameworkCore;
using Microsoft.EntityFrameworkCore.Metadata.Builders;

namespace EventReview.Data.Configurations;

public sealed class NotificationCursorConfiguration : IEntityTypeConfiguration<NotificationCursor>
{
    public void Configure(EntityTypeBuilder<NotificationCursor> b)
    {
        b.ToTable("NotificationCursors");
        b.HasKey(c => c.Name);
        b.Property(c => c.Name).HasMaxLength(32);
        b.Property(c => c.Position).IsConcurrencyToken();
    }
}
