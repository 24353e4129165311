using System.Diagnostics;
using System.Diagnostics.Metrics;

namespace EventReview.Data.Telemetry;

/// <summary>
/// Counters of what the review server does, published on the .NET meter <see cref="MeterName"/> (and at
/// <c>/metrics</c> by the web app): check jobs by kind and outcome, sign-ins by result, and verified cases by result.
/// Counting costs nothing when no listener is attached (the command-line tool).
/// </summary>
public static class ReviewMetrics
{
    /// <summary>Name of the meter.</summary>
    public const string MeterName = "EventReview.Review";

    private static readonly Meter Meter = new(MeterName);
    private static readonly Counter<long> JobsStarted = Meter.CreateCounter<long>("eventreview.check_jobs.started", "{job}", "Check jobs started, by kind.");
    private static readonly Counter<long> JobsFinished = Meter.CreateCounter<long>("eventreview.check_jobs.finished", "{job}", "Check jobs that ended with a stored result, by kind.");
    private static readonly Counter<long> JobsFailed = Meter.CreateCounter<long>("eventreview.check_jobs.failed", "{job}",
        "Check jobs that ended without a result, by kind and reason (refused: bad input or state; error: unexpected; cancelled).");
    private static readonly Counter<long> SignIns = Meter.CreateCounter<long>("eventreview.sign_ins", "{sign_in}", "Sign-ins by result (succeeded, failed; a lock-out counts as failed).");
    private static readonly Counter<long> VerifiedCases = Meter.CreateCounter<long>("eventreview.verify.cases", "{case}", "Cases verified, by result (valid, invalid).");

    /// <summary>A check job of <paramref name="kind"/> started.</summary>
    public static void JobStarted(string kind) => JobsStarted.Add(1, new KeyValuePair<string, object?>("kind", kind));

    /// <summary>A check job of <paramref name="kind"/> ended with a result.</summary>
    public static void JobFinished(string kind) => JobsFinished.Add(1, new KeyValuePair<string, object?>("kind", kind));

    /// <summary>A check job of <paramref name="kind"/> ended without a result; <paramref name="reason"/> is refused, error or cancelled.</summary>
    public static void JobFailed(string kind, string reason) =>
        JobsFailed.Add(1, new TagList { { "kind", kind }, { "reason", reason } });

    /// <summary>A sign-in (password or single sign-on) ended.</summary>
    public static void SignIn(bool succeeded) => SignIns.Add(1, new KeyValuePair<string, object?>("result", succeeded ? "succeeded" : "failed"));

    /// <summary>One case was verified.</summary>
    public static void CaseVerified(bool valid) => VerifiedCases.Add(1, new KeyValuePair<string, object?>("result", valid ? "valid" : "invalid"));
}
