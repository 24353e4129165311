namespace EventReview.Core.Injections;

/// <summary>Output of sealing a record.</summary>
/// <param name="Commitment">Lowercase hex SHA-256 of the salt bytes followed by the record bytes (64 characters).</param>
/// <param name="Salt">The random 32-byte salt in lowercase hex (64 characters); keep it secret until opening.</param>
public sealed record SealResult(string Commitment, string Salt);
