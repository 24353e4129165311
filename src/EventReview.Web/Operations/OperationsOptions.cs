namespace EventReview.Web.Operations;

/// <summary>Settings under <c>EventReview:Operations</c>.</summary>
public sealed class OperationsOptions
{
    public const string Section = "EventReview:Operations";

    /// <summary>Free space below which <c>/healthz</c> reports the attachment folder as failing (bytes; default 1 GB).</summary>
    public long MinimumFreeBytes { get; set; } = 1_000_000_000;

    /// <summary>
    /// Worker threads the thread pool keeps ready (default 64). The SQLite driver does its I/O synchronously, so under
    /// many concurrent requests a small pool waits for new threads; start with enough of them.
    /// </summary>
    public int MinWorkerThreads { get; set; } = 64;

    /// <summary>Write logs as one JSON object per line (default: on outside Development).</summary>
    public bool? JsonLogs { get; set; }

    /// <summary>
    /// Addresses of reverse proxies whose X-Forwarded-For/-Proto headers are trusted (default: loopback only).
    /// Requests from anywhere else keep their own address and scheme.
    /// </summary>
    public string[] TrustedProxies { get; set; } = [];
}
