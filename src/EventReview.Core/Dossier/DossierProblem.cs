namespace EventReview.Core.Dossier;

/// <summary>
/// One thing that does not verify: the <paramref name="File"/> inside the ZIP, where in it
/// (<paramref name="Where"/>: "timeline entry 3", "item timing.delay", ...; null for the whole file) and what is wrong.
/// </summary>
public sealed record DossierProblem(string File, string? Where, string What)
{
    /// <summary>One line: "file: where: what".</summary>
    public override string ToString() => Where is null ? $"{File}: {What}" : $"{File}: {Where}: {What}";
}
