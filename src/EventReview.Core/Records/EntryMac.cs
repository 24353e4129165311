namespace EventReview.Core.Records;

/// <summary>
/// What an entry's MAC covers (version 1): the text <c>eventreview-entry-mac-v1 \n KEY-ID \n CHAIN \n HASH</c>, where
/// CHAIN names the chain ("case:" + candidate id, or "sign-in-audit") and HASH is the entry's own hash (which covers its
/// content, its facts and the previous entry's hash). The MAC is HMAC-SHA-256 under the key's MAC key.
/// </summary>
public static class EntryMac
{
    /// <summary>Chain name of the sign-in audit.</summary>
    public const string AuditChain = "sign-in-audit";

    /// <summary>Chain name of a case's timeline.</summary>
    public static string CaseChain(string candidateId) => "case:" + candidateId;

    public static string Input(string keyId, string chain, string hash) => string.Join('\n', "eventreview-entry-mac-v1", keyId, chain, hash);
}
