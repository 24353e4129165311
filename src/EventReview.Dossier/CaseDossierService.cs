using System.Security.Cryptography;
using System.IO.Compression;
using EventReview.Core.Cases;
using EventReview.Core.Dossier;
using EventReview.Data;
using Microsoft.EntityFrameworkCore;

namespace EventReview.Dossier;

/// <summary>
/// Exports a stored case as a dossier ZIP (shared by the web app and the CLI): loads the case with everything in it, the
/// network's sites and the configuration records of the case's sites, builds the document, writes the ZIP and notes
/// the export (manifest hash and chain head) outside the case's timeline.
/// </summary>
public sealed class CaseDossierService(IDbContextFactory<AppDbContext> dbFactory, AttachmentStore store, TimeProvider clock, Data.Records.RecordKeeping? records = null)
{
    /// <summary>Writes the dossier of case <paramref name="caseId"/> to <paramref name="output"/>; returns the export note.</summary>
    /// <exception cref="KeyNotFoundException">When there is no such case.</exception>
    public async Task<DossierExportRecord> ExportAsync(int caseId, Actor by, Stream output, CancellationToken ct = default)
    {
        await using var db = await dbFactory.CreateDbContextAsync(ct);
        var c = await db.CasesWithEverything().AsNoTracking().FirstOrDefaultAsync(x => x.Id == caseId, ct)
            ?? throw new KeyNotFoundException($"There is no case with id {caseId}.");
        var sites = (await db.Sites.AsNoTracking().ToListAsync(ct)).OrderBy(s => s.Code).ToList();
        var codes = c.Arrivals.Select(a => a.SiteCode).ToList();
        var snapshots = (await db.ConfigurationSnapshots.AsNoTracking().Where(s => s.ReviewCaseId == caseId || codes.Contains(s.SiteCode)).ToListAsync(ct))
            .OrderBy(s => s.Id).ToList();
        var doc = DossierBuilder.Build(c, sites, snapshots);
        using var buffer = new MemoryStream();
        await DossierExporter.ExportAsync(doc, store.Open, buffer, records?.Keys.Current, ct);
        buffer.Position = 0;
        string manifestSha;
        using (var zip = new ZipArchive(buffer, ZipArchiveMode.Read, leaveOpen: true))
        {
            var manifest = zip.GetEntry("manifest.json") ?? throw new InvalidDataException("The exported dossier has no manifest.json.");
            await using var m = manifest.Open();
            manifestSha = Convert.ToHexStringLower(await SHA256.HashDataAsync(m, ct));
        }

        buffer.Position = 0;
        await buffer.CopyToAsync(output, ct);
        var record = new DossierExportRecord(caseId, manifestSha, c.Timeline.MaxBy(a => a.Sequence)?.Hash ?? TimelineEntry.GenesisHash, buffer.Length, by,
            EventReview.Core.Time.RecordedTime.Normalize(clock.GetUtcNow()));
        db.DossierExports.Add(record);
        await db.SaveChangesAsync(ct);
        return record;
    }

    /// <summary>Earlier exports of a case, newest first.</summary>
    public async Task<IReadOnlyList<DossierExportRecord>> ExportsAsync(int caseId, CancellationToken ct = default)
    {
        await using var db = await dbFactory.CreateDbContextAsync(ct);
        return (await db.DossierExports.AsNoTracking().Where(e => e.ReviewCaseId == caseId).ToListAsync(ct)).OrderByDescending(e => e.ExportedAt).ToList();
    }
}
