using EventReview.Core.Cases;
using Microsoft.EntityFrameworkCore;
using Microsoft.EntityFrameworkCore.Metadata.Builders;

namespace EventReview.Data.Configurations;

public sealed class CaseArrivalConfiguration : IEntityTypeConfiguration<CaseArrival>
{
    public void Configure(EntityTypeBuilder<CaseArrival> b)
    {
        b.ToTable("CaseArrivals");
        b.HasKey(a => a.Id);
        b.Property(a => a.SiteCode).HasMaxLength(8).IsRequired();
        b.Ignore(a => a.Arrival);
    }
}
