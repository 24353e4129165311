namespace EventReview.Core.Dossier;

/// <summary>The result of verifying a dossier: valid when there is no problem.</summary>
public sealed record DossierVerification(bool Valid, IReadOnlyList<DossierProblem> Problems)
{
    /// <summary>A result holding <paramref name="problems"/> (valid when empty).</summary>
    public static DossierVerification Of(IReadOnlyList<DossierProblem> problems) => new(problems.Count == 0, problems);
}
