namespace EventReview.Web.Services.Checks;

/// <summary>An attached file used as input of a check: its role ("triggers"), name and SHA-256.</summary>
public sealed record CheckFileRef(string Role, string FileName, string Sha256);
