namespace EventReview.Core.Evidence.Roles;

/// <summary>A role guessed for a file, with what it was guessed from ("header site,flag,start_gps,end_gps").</summary>
/// <param name="Role">The guessed role (<see cref="FileRoleKind.Other"/> when nothing matched).</param>
/// <param name="Reason">What in the file or its name led to the guess, for people to check.</param>
public sealed record FileRoleGuess(FileRole Role, string Reason);
