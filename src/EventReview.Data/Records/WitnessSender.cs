using System.Net.Http.Headers;
using System.Text;
using System.Threading.Channels;

namespace EventReview.Data.Records;

/// <summary>
/// Posts witness lines to an HTTP endpoint in the background (<c>POST</c>, <c>application/x-ndjson</c>, the lines
/// waiting at that moment, newline-separated), retrying with a growing pause (up to a minute) while it fails. It never
/// holds up a write: at most <see cref="Capacity"/> lines wait; beyond that the oldest are dropped and counted (the
/// witness file still has them). Its state is shown on the Integrity page.
/// </summary>
public sealed class WitnessSender : IDisposable
{
    public const int Capacity = 10_000;

    private readonly Channel<string> _lines = Channel.CreateBounded<string>(new BoundedChannelOptions(Capacity) { FullMode = BoundedChannelFullMode.DropOldest, SingleReader = true });
    private readonly HttpClient _http = new() { Timeout = TimeSpan.FromSeconds(10) };
    private readonly CancellationTokenSource _stop = new();
    private readonly Task _loop;
    private long _dropped;

    private readonly TimeProvider _clock;

    public WitnessSender(Uri endpoint, TimeProvider? clock = null)
    {
        Endpoint = endpoint;
        _clock = clock ?? TimeProvider.System;
        _loop = Task.Run(LoopAsync);
    }

    public Uri Endpoint { get; }

    public DateTimeOffset? LastSent { get; private set; }

    public string? LastError { get; private set; }

    public long Dropped => Interlocked.Read(ref _dropped);

    public int Waiting => _lines.Reader.Count;

    public void Enqueue(string line)
    {
        if (_lines.Reader.Count >= Capacity)
        {
            Interlocked.Increment(ref _dropped);
        }

        _lines.Writer.TryWrite(line);
    }

    private async Task LoopAsync()
    {
        var pause = TimeSpan.FromSeconds(1);
        var batch = new List<string>();
        try
        {
            while (await _lines.Reader.WaitToReadAsync(_stop.Token))
            {
                while (batch.Count < 500 && _lines.Reader.TryRead(out var line))
                {
                    batch.Add(line);
                }

                try
                {
                    using var content = new StringContent(string.Join('\n', batch) + "\n", Encoding.UTF8);
                    content.Headers.ContentType = new MediaTypeHeaderValue("application/x-ndjson");
                    using var answer = await _http.PostAsync(Endpoint, content, _stop.Token);
                    answer.EnsureSuccessStatusCode();
                    LastSent = _clock.GetUtcNow();
                    LastError = null;
                    batch.Clear();
                    pause = TimeSpan.FromSeconds(1);
                }
                catch (Exception ex) when (ex is HttpRequestException or TaskCanceledException && !_stop.IsCancellationRequested)
                {
                    LastError = ex.Message;
                    await Task.Delay(pause, _stop.Token);
                    pause = TimeSpan.FromSeconds(Math.Min(60, pause.TotalSeconds * 2));
                }
            }
        }
        catch (OperationCanceledException)
        {
            // Shutting down; the witness file holds every line.
        }
    }

    private int _disposed;

    public void Dispose()
    {
        if (Interlocked.Exchange(ref _disposed, 1) == 1)
        {
            return;
        }

        _lines.Writer.TryComplete();
        _stop.Cancel();
        try
        {
            _loop.Wait(TimeSpan.FromSeconds(2));
        }
        catch (AggregateException)
        {
            // The loop ended with its cancellation.
        }

        _http.Dispose();
        _stop.Dispose();
    }
}
