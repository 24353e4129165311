using EventReview.Core.Checklists;
using Microsoft.EntityFrameworkCore;
using Microsoft.EntityFrameworkCore.Metadata.Builders;

namespace EventReview.Data.Configurations;

public sealed class ChecklistItemConfiguration : IEntityTypeConfiguration<ChecklistItem>
{
    public void Configure(EntityTypeBuilder<ChecklistItem> b)
    {
        b.ToTable("ChecklistItems");
        b.HasKey(i => i.Id);
        b.HasIndex(i => new { i.ReviewCaseId, i.Key }).IsUnique();
        b.Property(i => i.Key).HasMaxLength(64).IsRequired();
        b.Property(i => i.SectionKey).HasMaxLength(64);
        b.Property(i => i.SectionTitle).HasMaxLength(200);
        b.Property(i => i.Title).HasMaxLength(300);
        b.Property(i => i.CheckKind).HasMaxLength(32);
        b.Property(i => i.OwnerId).HasMaxLength(64);
        b.Property(i => i.OwnerName).HasMaxLength(200);
        b.Property(i => i.State).HasConversion<string>().HasMaxLength(32);
        b.Property(i => i.Version).IsConcurrencyToken();
        b.Ignore(i => i.CurrentSignOffs);
        b.Ignore(i => i.HasStaleSignOffs);
        b.Ignore(i => i.LatestComputation);
        b.HasMany(i => i.Evidence).WithOne().HasForeignKey(e => e.ChecklistItemId).OnDelete(DeleteBehavior.Restrict);
        b.HasMany(i => i.Computations).WithOne().HasForeignKey(e => e.ChecklistItemId).OnDelete(DeleteBehavior.Restrict);
        b.HasMany(i => i.SignOffs).WithOne().HasForeignKey(e => e.ChecklistItemId).OnDelete(DeleteBehavior.Restrict);
        b.Navigation(i => i.Evidence).UsePropertyAccessMode(PropertyAccessMode.Field);
        b.Navigation(i => i.Computations).UsePropertyAccessMode(PropertyAccessMode.Field);
        b.Navigation(i => i.SignOffs).UsePropertyAccessMode(PropertyAccessMode.Field);
    }
}
