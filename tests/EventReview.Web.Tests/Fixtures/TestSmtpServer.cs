using System.Buffers;
using System.Collections.Concurrent;
using System.Net;
using System.Net.Sockets;
using MimeKit;
using SmtpServer;
using SmtpServer.Protocol;
using SmtpServer.Storage;

namespace EventReview.Web.Tests.Fixtures;

/// <summary>
/// An SMTP server started in the test on a local port (the SmtpServer package, plain SMTP without TLS), keeping every
/// message it receives. It can be stopped and started again on the same port to play an unreachable server.
/// </summary>
public sealed class TestSmtpServer : IAsyncDisposable
{
    private SmtpServer.SmtpServer? _server;
    private CancellationTokenSource? _stop;
    private Task? _running;

    public TestSmtpServer(int? port = null)
    {
        Port = port ?? FreePort();
    }

    public int Port { get; }

    public ConcurrentQueue<MimeMessage> Messages { get; } = new();

    public bool Running => _server is not null;

    public TestSmtpServer Start()
    {
        var options = new SmtpServerOptionsBuilder().ServerName("smtp.test.invalid")
            .Endpoint(b => b.Endpoint(new IPEndPoint(IPAddress.Loopback, Port))).Build();
        var services = new SmtpServer.ComponentModel.ServiceProvider();
        services.Add(new Store(Messages));
        _server = new SmtpServer.SmtpServer(options, services);
        _stop = new CancellationTokenSource();
        _running = _server.StartAsync(_stop.Token);
        WaitListening();
        return this;
    }

    public async Task StopAsync()
    {
        if (_server is null)
        {
            return;
        }

        _server.Shutdown();
        await _stop!.CancelAsync();
        try
        {
            await _running!.WaitAsync(TimeSpan.FromSeconds(10));
        }
        catch (OperationCanceledException)
        {
        }

        _server = null;
    }

    /// <summary>Waits until a message matching <paramref name="match"/> has arrived (or fails after <paramref name="seconds"/>).</summary>
    public async Task<MimeMessage> WaitForAsync(Func<MimeMessage, bool> match, int seconds = 20)
    {
        var deadline = DateTime.UtcNow.AddSeconds(seconds);
        while (DateTime.UtcNow < deadline)
        {
            if (Messages.FirstOrDefault(match) is { } m)
            {
                return m;
            }

            await Task.Delay(100);
        }

        throw new TimeoutException($"No matching message within {seconds} s; received: {string.Join(" | ", Messages.Select(m => $"{m.To} {m.Subject}"))}");
    }

    public async ValueTask DisposeAsync() => await StopAsync();

    private void WaitListening()
    {
        var deadline = DateTime.UtcNow.AddSeconds(10);
        while (DateTime.UtcNow < deadline)
        {
            try
            {
                using var probe = new TcpClient();
                probe.Connect(IPAddress.Loopback, Port);
                return;
            }
            catch (SocketException)
            {
                Thread.Sleep(50);
            }
        }

        throw new TimeoutException($"The test SMTP server did not listen on port {Port}.");
    }

    private static int FreePort()
    {
        using var listener = new TcpListener(IPAddress.Loopback, 0);
        listener.Start();
        return ((IPEndPoint)listener.LocalEndpoint).Port;
    }

    private sealed class Store(ConcurrentQueue<MimeMessage> messages) : MessageStore
    {
        public override async Task<SmtpResponse> SaveAsync(ISessionContext context, IMessageTransaction transaction, ReadOnlySequence<byte> buffer, CancellationToken cancellationToken)
        {
            using var stream = new MemoryStream(buffer.ToArray());
            messages.Enqueue(await MimeMessage.LoadAsync(stream, cancellationToken));
            return SmtpResponse.Ok;
        }
    }
}
