namespace EventReview.Core.Cases;

/// <summary>Who does something: the account id and the printed name shown in the record.</summary>
public sealed record Actor(string UserId, string DisplayName)
{
    /// <summary>The system itself (seeding, migrations).</summary>
    public static Actor System { get; } = new("system", "EventReview");
}
