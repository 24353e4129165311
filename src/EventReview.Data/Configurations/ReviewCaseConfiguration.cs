using EventReview.Core.Cases;
using Microsoft.EntityFrameworkCore;
using Microsoft.EntityFrameworkCore.Metadata.Builders;

namespace EventReview.Data.Configurations;

public sealed class ReviewCaseConfiguration : IEntityTypeConfiguration<ReviewCase>
{
    public void Configure(EntityTypeBuilder<ReviewCase> b)
    {
        b.ToTable("Cases");
        b.HasKey(c => c.Id);
        b.HasIndex(c => c.CandidateId).IsUnique();
        b.HasIndex(c => c.GpsNanoseconds); // paging and sorting large case lists by event time
        b.HasIndex(c => c.State);
        b.Property(c => c.CandidateId).HasMaxLength(128).IsRequired();
        b.Property(c => c.Search).HasMaxLength(200);
        b.Property(c => c.Summary).HasMaxLength(20_000);
        b.Property(c => c.State).HasConversion<string>().HasMaxLength(32);
        b.Property(c => c.Outcome).HasConversion<string>().HasMaxLength(32);
        b.Property(c => c.CoordinatorId).HasMaxLength(64);
        b.Property(c => c.CoordinatorName).HasMaxLength(200);
        b.Property(c => c.ChecklistName).HasMaxLength(100);
        b.Property(c => c.Version).IsConcurrencyToken();
        b.Ignore(c => c.Gps);
        b.Ignore(c => c.NetworkSnr);
        b.Ignore(c => c.SignedItemCount);
        b.Ignore(c => c.StaleItemCount);
        b.HasMany(c => c.Arrivals).WithOne().HasForeignKey("ReviewCaseId").OnDelete(DeleteBehavior.Cascade);
        b.HasMany(c => c.Items).WithOne().HasForeignKey(i => i.ReviewCaseId).OnDelete(DeleteBehavior.Restrict);
        b.HasMany(c => c.Timeline).WithOne().HasForeignKey(a => a.ReviewCaseId).OnDelete(DeleteBehavior.Restrict);
        b.Navigation(c => c.Arrivals).UsePropertyAccessMode(PropertyAccessMode.Field);
        b.Navigation(c => c.Items).UsePropertyAccessMode(PropertyAccessMode.Field);
        b.Navigation(c => c.Timeline).UsePropertyAccessMode(PropertyAccessMode.Field);
    }
}
