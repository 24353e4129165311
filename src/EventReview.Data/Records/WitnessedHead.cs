namespace EventReview.Data.Records;

/// <summary>
/// The newest entry of one chain as written: the chain's name (<see cref="Core.Records.EntryMac.CaseChain"/> or
/// <see cref="Core.Records.EntryMac.AuditChain"/>), the entry's sequence number and its hash.
/// </summary>
public sealed record WitnessedHead(string Chain, long Sequence, string Hash);
