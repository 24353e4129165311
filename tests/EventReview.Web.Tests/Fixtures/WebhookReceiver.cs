using System.Collections.Concurrent;
using System.Net;
using System.Net.Sockets;
using Microsoft.AspNetCore.Builder;
using Microsoft.AspNetCore.Hosting;
using Microsoft.AspNetCore.Http;
using Microsoft.Extensions.Logging;

namespace EventReview.Web.Tests.Fixtures;

/// <summary>A local webhook receiver (Kestrel on a free port) that keeps every request; it can refuse the next few.</summary>
public sealed class WebhookReceiver : IAsyncDisposable
{
    private readonly WebApplication _app;
    private int _refuse;

    private WebhookReceiver(WebApplication app, string url)
    {
        _app = app;
        Url = url;
    }

    /// <summary>The address to give as a webhook.</summary>
    public string Url { get; }

    /// <summary>Requests received (also the refused ones), with their headers and body.</summary>
    public ConcurrentQueue<Received> Requests { get; } = new();

    /// <summary>Answer the next <paramref name="count"/> requests with 503.</summary>
    public void RefuseNext(int count) => Interlocked.Exchange(ref _refuse, count);

    public static async Task<WebhookReceiver> StartAsync()
    {
        using var l = new TcpListener(IPAddress.Loopback, 0);
        l.Start();
        var port = ((IPEndPoint)l.LocalEndpoint).Port;
        l.Stop();
        var builder = WebApplication.CreateSlimBuilder();
        builder.WebHost.UseUrls($"http://127.0.0.1:{port}");
        builder.Logging.ClearProviders();
        var app = builder.Build();
        var receiver = new WebhookReceiver(app, $"http://127.0.0.1:{port}/hooks/eventreview");
        app.MapPost("/hooks/eventreview", async (HttpContext http) =>
        {
            using var reader = new StreamReader(http.Request.Body);
            var body = await reader.ReadToEndAsync();
            var refused = Interlocked.Decrement(ref receiver._refuse) >= 0;
            receiver.Requests.Enqueue(new Received(http.Request.Headers.ToDictionary(h => h.Key, h => h.Value.ToString(), StringComparer.OrdinalIgnoreCase), body, refused));
            return refused ? Results.StatusCode(StatusCodes.Status503ServiceUnavailable) : Results.NoContent();
        });
        await app.StartAsync();
        return receiver;
    }

    public async ValueTask DisposeAsync()
    {
        await _app.StopAsync();
        await _app.DisposeAsync();
    }

    public sealed record Received(IReadOnlyDictionary<string, string> Headers, string Body, bool Refused);
}
