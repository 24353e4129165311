namespace EventReview.Data.Auth;

/// <summary>Whether an API token can be used at a given time.</summary>
public enum TokenState
{
    Active,
    Expired,
    Revoked,
}
