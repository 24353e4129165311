namespace EventReview.Web.Operations;

/// <summary>Body of <c>GET /healthz</c>: overall status and one line per part checked.</summary>
/// <param name="Status">"ok" when every part passed, otherwise "failing".</param>
/// <param name="Checks">Each part checked, in a fixed order.</param>
public sealed record HealthReport(string Status, IReadOnlyList<HealthCheckLine> Checks)
{
    [System.Text.Json.Serialization.JsonIgnore]
    public bool Healthy => Checks.All(c => c.Ok);
}

/// <summary>One part of the health report.</summary>
/// <param name="Name">database, migrations, attachments, leap-seconds, record-key or witness.</param>
/// <param name="Ok">Whether it passed.</param>
/// <param name="Detail">What was found, in words (never a secret or a connection string).</param>
/// <param name="Warning">Passed, but something should be changed (the detail says what); does not fail the report.</param>
public sealed record HealthCheckLine(string Name, bool Ok, string Detail, bool Warning = false);
