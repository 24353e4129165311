namespace EventReview.Core.Records;

/// <summary>
/// Every record key the server has used: the current one (which signs) and retired ones (which still verify what they
/// signed). Public keys are listed with their validity, so signatures can be checked by anyone holding them; entry MACs
/// can only be checked by a holder of the private key.
/// </summary>
public interface IRecordKeyRing
{
    /// <summary>The key that signs new entries, or null when the ring holds no private key (verification only).</summary>
    IRecordSigner? Current { get; }

    /// <summary>Every public key, oldest first, with its validity.</summary>
    IReadOnlyList<RecordPublicKey> Keys { get; }

    /// <summary>True when <paramref name="mac"/> is the entry MAC of <paramref name="data"/> under key <paramref name="keyId"/>;
    /// null when the ring does not hold that key's private part.</summary>
    bool? MacMatches(string keyId, string data, string mac);
}
