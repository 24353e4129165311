using EventReview.Core.Cases;

namespace EventReview.Core.Injections;

/// <summary>
/// A registered seal of a blind-injection record: only the commitment (lowercase hex SHA-256 of salt bytes followed by
/// the record bytes, see <see cref="SealedRecord"/>), a label, who registered it and when. The tool never sees the record
/// until it is opened; opening checks the record and salt against the commitment and, only when they match, keeps the
/// revealed record and salt (so anyone can re-verify) with who opened it, when, in which case and what it showed.
/// A seal is opened at most once.
/// </summary>
public sealed class SealedInjectionRecord
{
    private SealedInjectionRecord()
    {
        Commitment = string.Empty;
        Label = string.Empty;
        SealedById = string.Empty;
        SealedByName = string.Empty;
    }

    /// <summary>Database key of the seal.</summary>
    public int Id { get; private set; }

    /// <summary>Lowercase hex SHA-256 (64 characters) of the salt bytes followed by the record bytes.</summary>
    public string Commitment { get; private set; }

    /// <summary>A short name for people ("blind injections, observing period 3").</summary>
    public string Label { get; private set; }

    /// <summary>User id of whoever registered the seal.</summary>
    public string SealedById { get; private set; }

    /// <summary>Printed name of whoever registered the seal, as it was then.</summary>
    public string SealedByName { get; private set; }

    /// <summary>When the seal was registered in the tool (UTC).</summary>
    public DateTimeOffset SealedAt { get; private set; }

    /// <summary>User id of whoever opened the seal; null until opened.</summary>
    public string? OpenedById { get; private set; }

    /// <summary>Printed name of whoever opened the seal; null until opened.</summary>
    public string? OpenedByName { get; private set; }

    /// <summary>When the seal was opened (UTC); null until opened.</summary>
    public DateTimeOffset? OpenedAt { get; private set; }

    /// <summary>Id of the case in which the record was opened, or null.</summary>
    public int? OpenedInCaseId { get; private set; }

    /// <summary>One line: what the opened record showed for that case (e.g. "2 blind injections; none overlaps ER-C-0142").</summary>
    public string? OpenedSummary { get; private set; }

    /// <summary>The revealed record bytes, exactly as verified; null until opened.</summary>
    public byte[]? OpenedRecord { get; private set; }

    /// <summary>The revealed salt (lowercase hex); null until opened.</summary>
    public string? OpenedSalt { get; private set; }

    /// <summary>True once the record has been opened.</summary>
    public bool IsOpened => OpenedAt is not null;

    /// <summary>Registers a seal.</summary>
    /// <param name="commitment">64 hex digits (any case, surrounding white space ignored); stored in lower case.</param>
    /// <param name="label">Non-empty label, at most 200 characters.</param>
    /// <param name="by">Who registers it.</param>
    /// <param name="now">When (UTC).</param>
    /// <exception cref="ArgumentException">When the commitment is not 64 hex digits or the label is empty or too long.</exception>
    public static SealedInjectionRecord Register(string commitment, string label, Actor by, DateTimeOffset now)
    {
        ArgumentNullException.ThrowIfNull(by);
        var c = (commitment ?? string.Empty).Trim().ToLowerInvariant();
        if (c.Length != 64 || !c.All(char.IsAsciiHexDigit))
        {
            throw new ArgumentException("The commitment must be the 64 hex digits of a SHA-256 (as printed by 'eventreview seal').", nameof(commitment));
        }

        var l = (label ?? string.Empty).Trim();
        if (l.Length is 0 or > 200)
        {
            throw new ArgumentException("The label must be 1 to 200 characters.", nameof(label));
        }

        return new SealedInjectionRecord { Commitment = c, Label = l, SealedById = by.UserId, SealedByName = by.DisplayName, SealedAt = now };
    }

    /// <summary>
    /// True when the record and salt match the commitment (nothing changes).
    /// </summary>
    /// <exception cref="FormatException">When the salt is not hex.</exception>
    public bool Matches(byte[] record, string saltHex) => SealedRecord.Verify(Commitment, record, saltHex);

    /// <summary>
    /// Opens the seal: verifies record and salt against the commitment and records who opened it, when, where and what it showed.
    /// </summary>
    /// <exception cref="DomainRuleException">Rule "commitment-mismatch" when the record or salt does not match (or the salt
    /// is not hex); rule "seal-already-opened" when it was opened before. Nothing changes in either case.</exception>
    public void Open(byte[] record, string saltHex, int caseId, string summary, Actor by, DateTimeOffset now)
    {
        ArgumentNullException.ThrowIfNull(record);
        ArgumentNullException.ThrowIfNull(by);
        if (IsOpened)
        {
            throw new DomainRuleException("seal-already-opened", $"The sealed record '{Label}' was already opened by {OpenedByName} at {OpenedAt:u}.");
        }

        bool ok;
        try
        {
            ok = Matches(record, saltHex ?? string.Empty);
        }
        catch (FormatException)
        {
            ok = false;
        }

        if (!ok)
        {
            throw new DomainRuleException("commitment-mismatch", "The record or salt does not match the commitment; nothing was opened.");
        }

        OpenedById = by.UserId;
        OpenedByName = by.DisplayName;
        OpenedAt = now;
        OpenedInCaseId = caseId;
        OpenedSummary = summary;
        OpenedRecord = [.. record];
        OpenedSalt = saltHex!.Trim().ToLowerInvariant();
    }
}
