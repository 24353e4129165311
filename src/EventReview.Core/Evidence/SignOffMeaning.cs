namespace EventReview.Core.Evidence;

/// <summary>What a signature means.</summary>
public enum SignOffMeaning
{
    /// <summary>"I have reviewed the evidence and agree with it."</summary>
    Reviewed,

    /// <summary>"I approve this item as complete."</summary>
    Approved,
}
