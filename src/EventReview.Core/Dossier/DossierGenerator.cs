namespace EventReview.Core.Dossier;

/// <summary>Name and version of the program that built the dossier.</summary>
public sealed record DossierGenerator(string Name, string Version);
