using EventReview.Core.Dossier;
using Microsoft.EntityFrameworkCore;
using Microsoft.EntityFrameworkCore.Metadata.Builders;

namespace EventReview.Data.Configurations;

public sealed class DossierExportRecordConfiguration : IEntityTypeConfiguration<DossierExportRecord>
{
    public void Configure(EntityTypeBuilder<DossierExportRecord> b)
    {
        b.ToTable("DossierExports");
        b.HasKey(e => e.Id);
        b.HasIndex(e => e.ReviewCaseId);
        b.Property(e => e.ManifestSha256).HasMaxLength(64);
        b.Property(e => e.ChainHead).HasMaxLength(64);
        b.Property(e => e.ExportedBy).HasMaxLength(64);
        b.Property(e => e.ExportedByName).HasMaxLength(200);
        b.HasOne<Core.Cases.ReviewCase>().WithMany().HasForeignKey(e => e.ReviewCaseId).OnDelete(DeleteBehavior.Restrict);
    }
}
