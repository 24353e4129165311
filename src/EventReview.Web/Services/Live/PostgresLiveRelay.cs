using System.Text.RegularExpressions;
using System.Threading.Channels;
using EventReview.Core.Live;
using Npgsql;

namespace EventReview.Web.Services.Live;

/// <summary>
/// Live news between app instances on one PostgreSQL database: this instance's payloads go out with
/// <c>pg_notify</c> on the channel (<see cref="DefaultChannel"/> unless configured), and a dedicated connection
/// <c>LISTEN</c>s on it and waits (<see cref="NpgsqlConnection.WaitAsync(CancellationToken)"/>) for the others'. When
/// that connection drops, it connects again after <see cref="ReconnectDelay"/> and tells every open page to reload, as
/// news may have been missed meanwhile. The payloads carry ids only; nothing is ever read from them but that. Sending
/// is off the writer's path and best effort: a notification that cannot be sent is logged, the data is already committed.
/// </summary>
public sealed partial class PostgresLiveRelay(CaseBus bus, string connectionString, string channel, ILogger<PostgresLiveRelay> log) : BackgroundService, ILiveRelay
{
    /// <summary>The channel name used unless <c>EventReview:Live:Channel</c> says otherwise.</summary>
    public const string DefaultChannel = "eventreview_live";

    /// <summary>Most payloads waiting to go out; beyond it the oldest are dropped (the pages of the others miss a redraw, never data).</summary>
    public const int MaxWaiting = 10_000;

    private readonly Channel<string> _outgoing = Channel.CreateBounded<string>(new BoundedChannelOptions(MaxWaiting) { FullMode = BoundedChannelFullMode.DropOldest, SingleReader = true });
    private readonly string _channel = ValidChannel(channel);

    /// <summary>True while the listening connection is up.</summary>
    public bool Listening { get; private set; }

    /// <summary>Times the listener connected (1 after start-up; more after reconnects).</summary>
    public int Connections { get; private set; }

    public void Send(string payload) => _outgoing.Writer.TryWrite(payload);

    /// <summary>A channel name is an SQL identifier written into <c>LISTEN</c>: lower-case letters, digits and underscores, up to 63.</summary>
    public static string ValidChannel(string channel) => ChannelName().IsMatch(channel)
        ? channel
        : throw new ArgumentException($"EventReview:Live:Channel \"{channel}\" is not a channel name: use lower-case letters, digits and underscores (up to 63, not starting with a digit).", nameof(channel));

    protected override Task ExecuteAsync(CancellationToken stoppingToken)
    {
        bus.UseRelay(this);
        return Task.WhenAll(ListenAsync(stoppingToken), SendAsync(stoppingToken));
    }

    private async Task ListenAsync(CancellationToken stop)
    {
        var failures = 0;
        // Keep-alive makes a silently dead connection (a dropped network) fail within seconds instead of waiting forever.
        var listen = new NpgsqlConnectionStringBuilder(connectionString) { KeepAlive = 10, Pooling = false, ApplicationName = "eventreview-live" }.ConnectionString;
        while (!stop.IsCancellationRequested)
        {
            try
            {
                await using var connection = new NpgsqlConnection(listen);
                await connection.OpenAsync(stop);
                connection.Notification += (_, e) => bus.Receive(e.Payload);
                await using (var command = new NpgsqlCommand($"LISTEN {_channel}", connection))
                {
                    await command.ExecuteNonQueryAsync(stop);
                }

                Listening = true;
                if (++Connections > 1)
                {
                    log.LogInformation("Live channel {Channel} listening again after {Failures} failure(s); open case pages reload", _channel, failures);
                    bus.ResyncAll();
                }

                failures = 0;
                while (true)
                {
                    await connection.WaitAsync(stop);
                }
            }
            catch (OperationCanceledException) when (stop.IsCancellationRequested)
            {
                return;
            }
            catch (Exception ex)
            {
                Listening = false;
                var wait = ReconnectDelay.After(++failures);
                log.LogWarning(ex, "Live channel {Channel}: listening connection lost; connecting again in {Wait} s", _channel, wait.TotalSeconds);
                try
                {
                    await Task.Delay(wait, stop);
                }
                catch (OperationCanceledException)
                {
                    return;
                }
            }
        }
    }

    private async Task SendAsync(CancellationToken stop)
    {
        try
        {
            while (await _outgoing.Reader.WaitToReadAsync(stop))
            {
                try
                {
                    await using var connection = new NpgsqlConnection(connectionString);
                    await connection.OpenAsync(stop);
                    while (_outgoing.Reader.TryRead(out var payload))
                    {
                        await using var command = new NpgsqlCommand("SELECT pg_notify(@channel, @payload)", connection);
                        command.Parameters.AddWithValue("channel", _channel);
                        command.Parameters.AddWithValue("payload", payload);
                        await command.ExecuteNonQueryAsync(stop);
                    }
                }
                catch (Exception ex) when (ex is not OperationCanceledException)
                {
                    log.LogWarning(ex, "Live channel {Channel}: a notification could not be sent (the change itself is stored)", _channel);
                    await Task.Delay(ReconnectDelay.First, stop);
                }
            }
        }
        catch (OperationCanceledException)
        {
            // Shutting down.
        }
    }

    [GeneratedRegex("^[a-z_][a-z0-9_]{0,62}$")]
    private static partial Regex ChannelName();
}
