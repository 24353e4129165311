namespace EventReview.Web.Operations;

/// <summary>Settings under <c>EventReview:Operations</c>.</summary>
public sealed class OperationsOptions
{
    public const string Section = "EventReview:Operations";

    /// <summary>Free space below which <c>/healthz/ready</c> reports the attachment folder as failing (bytes; default 1 GB).</summary>
    public long MinimumFreeBytes { get; set; } = 1_000_000_000;

    /// <summary>Free space below which <c>/healthz/ready</c> reports the server as degraded: disk space low (bytes; default 5 GB).</summary>
    public long LowFreeBytes { get; set; } = 5_000_000_000;

    /// <summary>
    /// Worker threads the thread pool keeps ready (default 64). The SQLite driver does its I/O synchronously, so under
    /// many concurrent requests a small pool waits for new threads; start with enough of them.
    /// </summary>
    public int MinWorkerThreads { get; set; } = 64;

    /// <summary>
    /// Answer pages reached over plain HTTP with a page saying to use HTTPS (default: on outside Development). Sign-in
    /// cookies are Secure there, so a page over HTTP could not work anyway; the API, <c>/openapi</c> and <c>/healthz</c>
    /// still answer over HTTP for loopback checks and tools.
    /// </summary>
    public bool? RequireHttps { get; set; }

    /// <summary>Write logs as one JSON object per line (default: on outside Development).</summary>
    public bool? JsonLogs { get; set; }

    /// <summary>
    /// Addresses or networks of reverse proxies whose X-Forwarded-For/-Proto headers are trusted (default: none, not
    /// even loopback; a proxy on the same machine is listed as <c>127.0.0.1</c> or <c>::1</c>). Requests from anywhere
    /// else keep their own address and scheme.
    /// </summary>
    public string[] TrustedProxies { get; set; } = [];

    /// <summary>
    /// Seconds a checked API token is remembered before it is read from the database again (default 5; 0: read on every
    /// request). Revoking a token on the Tokens page takes effect at once; revoking it with the command-line tool, in
    /// another process, takes effect within this time. Expiry is always checked on the request's own clock.
    /// </summary>
    public int TokenCacheSeconds { get; set; } = 5;
}
