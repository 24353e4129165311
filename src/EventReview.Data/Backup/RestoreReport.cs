using System.Text.Json.Serialization;
using EventReview.Core.Cases;

namespace EventReview.Data.Backup;

/// <summary>
/// What a restore did: the target folder, files and bytes placed, attachments and cases restored, how long it took,
/// and the outcome of the full integrity verification of the restored copy (<see cref="Valid"/> and the
/// <see cref="Problems"/> found, each naming the case, entry or item). <see cref="Placed"/> is false when an invalid
/// copy was not moved into the target (the target is then as it was). <see cref="PreviousFolderMovedTo"/> is where a
/// non-empty target folder was moved when <c>--force</c> was given (null otherwise). <see cref="Notes"/> lists cases
/// whose witness saw entries newer than the backup (written after it was taken, so not in it).
/// </summary>
public sealed record RestoreReport(
    string TargetPath,
    [property: JsonConverter(typeof(JsonStringEnumConverter<DatabaseProvider>))] DatabaseProvider Provider,
    DateTimeOffset BackupCreatedUtc,
    int Files,
    long Bytes,
    int AttachmentCount,
    int CaseCount,
    int TimelineEntries,
    double DurationSeconds,
    bool Valid,
    bool Placed,
    IReadOnlyList<IntegrityProblem> Problems,
    string? PreviousFolderMovedTo,
    IReadOnlyList<string>? Notes = null);
