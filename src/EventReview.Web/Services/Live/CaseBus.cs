using System.Threading.Channels;
using EventReview.Core.Live;
using EventReview.Core.Records;
using EventReview.Data.Records;

namespace EventReview.Web.Services.Live;

/// <summary>
/// The live case feed of one app instance. Committed writes arrive from the record keeping (<see cref="RecordKeeping.Committed"/>,
/// called by every writer after its commit and never for a write that rolled back) as chain heads; the bus tells each
/// case's subscribers (the open case pages of this instance) that the case changed and hands the same news, as ids only,
/// to the relay for the other instances (<see cref="ILiveRelay"/>), whose messages come back in through <see cref="Receive"/>.
/// Presence beats take the same two ways and are kept in memory (<see cref="PresenceBoard"/>). Subscribers run on a
/// background loop, off the writer's path; a subscriber that fails is logged and keeps its subscription.
/// </summary>
public sealed class CaseBus : IDisposable
{
    private readonly PresenceBoard _board = new();
    private readonly TimeProvider _clock;
    private readonly ILogger<CaseBus> _log;
    private readonly Lock _lock = new();
    private readonly Dictionary<string, List<Subscription>> _subscribers = new(StringComparer.Ordinal);
    private readonly Channel<(string CandidateId, LiveSignal Signal)> _signals = Channel.CreateUnbounded<(string, LiveSignal)>(new UnboundedChannelOptions { SingleReader = true });
    private readonly Task _loop;
    private readonly IDisposable? _commits;
    private ILiveRelay? _relay;

    public CaseBus(TimeProvider clock, ILogger<CaseBus> log, RecordKeeping? records = null)
    {
        _clock = clock;
        _log = log;
        _commits = records?.ObserveCommits(Committed);
        _loop = Task.Run(LoopAsync);
    }

    /// <summary>This instance's id on the channel, so that it can skip its own messages when they come back.</summary>
    public string Origin { get; } = Guid.NewGuid().ToString("N");

    /// <summary>Sends this instance's news to the other instances from now on (set once, by the relay as it starts).</summary>
    public void UseRelay(ILiveRelay relay) => _relay = relay;

    /// <summary>Calls <paramref name="handler"/> for every signal about the case until the result is disposed.</summary>
    public IDisposable Subscribe(string candidateId, Func<LiveSignal, Task> handler)
    {
        var subscription = new Subscription(this, candidateId, handler);
        lock (_lock)
        {
            if (!_subscribers.TryGetValue(candidateId, out var list))
            {
                _subscribers[candidateId] = list = [];
            }

            list.Add(subscription);
        }

        return subscription;
    }

    /// <summary>Number of live subscriptions (all cases), for tests and diagnostics.</summary>
    public int SubscriberCount
    {
        get
        {
            lock (_lock)
            {
                return _subscribers.Values.Sum(l => l.Count);
            }
        }
    }

    /// <summary>The heads of a committed write: every case chain among them is announced here and to the other instances.</summary>
    public void Committed(IReadOnlyCollection<WitnessedHead> heads)
    {
        foreach (var head in heads.Where(h => h.Chain.StartsWith(CasePrefix, StringComparison.Ordinal)).GroupBy(h => h.Chain))
        {
            var change = new CaseChanged(head.Key[CasePrefix.Length..], (int)head.Max(h => h.Sequence));
            Signal(change.CandidateId, LiveSignal.CaseChanged);
            _relay?.Send(LivePayload.Format(Origin, change));
        }
    }

    /// <summary>A presence beat of a page of this instance: kept, shown here, and sent to the other instances.</summary>
    public void Beat(PresenceBeat beat)
    {
        if (_board.Apply(beat, _clock.GetUtcNow()))
        {
            Signal(beat.CandidateId, LiveSignal.PresenceChanged);
        }

        _relay?.Send(LivePayload.Format(Origin, beat));
    }

    /// <summary>Who has the case open (any instance), at most <see cref="PresenceBoard.Expiry"/> since their last beat.</summary>
    public IReadOnlyList<PresenceBeat> Here(string candidateId) => _board.Here(candidateId, _clock.GetUtcNow());

    /// <summary>
    /// A payload from another instance. A malformed one is logged and ignored; this instance's own are skipped. Returns
    /// the message as read (for tests).
    /// </summary>
    public LiveMessage Receive(string? payload)
    {
        var message = LivePayload.Parse(payload);
        if (!message.Ok)
        {
            _log.LogWarning("Ignored a live message that could not be read: {Problem}", message.Problem);
            return message;
        }

        if (message.Origin == Origin)
        {
            return message;
        }

        if (message.Change is { } change)
        {
            Signal(change.CandidateId, LiveSignal.CaseChanged);
        }
        else if (message.Presence is { } beat && _board.Apply(beat, _clock.GetUtcNow()))
        {
            Signal(beat.CandidateId, LiveSignal.PresenceChanged);
        }

        return message;
    }

    /// <summary>Tells every subscriber to reload (after the channel to the other instances was down: news may be missing).</summary>
    public void ResyncAll()
    {
        List<string> cases;
        lock (_lock)
        {
            cases = [.. _subscribers.Keys];
        }

        foreach (var c in cases)
        {
            Signal(c, LiveSignal.CaseChanged);
        }
    }

    public void Dispose()
    {
        _commits?.Dispose();
        _signals.Writer.TryComplete();
        _loop.Wait(TimeSpan.FromSeconds(2));
    }

    /// <summary>Start of every case chain's name (<see cref="EntryMac.CaseChain"/> of the candidate id).</summary>
    private static readonly string CasePrefix = EntryMac.CaseChain(string.Empty);

    private void Signal(string candidateId, LiveSignal signal) => _signals.Writer.TryWrite((candidateId, signal));

    private async Task LoopAsync()
    {
        await foreach (var (candidateId, signal) in _signals.Reader.ReadAllAsync())
        {
            Subscription[] targets;
            lock (_lock)
            {
                targets = _subscribers.TryGetValue(candidateId, out var list) ? [.. list] : [];
            }

            foreach (var s in targets)
            {
                _ = s.RunAsync(signal);
            }
        }
    }

    private void Remove(Subscription subscription)
    {
        lock (_lock)
        {
            if (_subscribers.TryGetValue(subscription.CandidateId, out var list) && list.Remove(subscription) && list.Count == 0)
            {
                _subscribers.Remove(subscription.CandidateId);
            }
        }
    }

    private sealed class Subscription(CaseBus bus, string candidateId, Func<LiveSignal, Task> handler) : IDisposable
    {
        private int _disposed;

        public string CandidateId { get; } = candidateId;

        public async Task RunAsync(LiveSignal signal)
        {
            if (Volatile.Read(ref _disposed) != 0)
            {
                return;
            }

            try
            {
                await handler(signal);
            }
            catch (Exception ex)
            {
                bus._log.LogWarning(ex, "A live subscriber of case {Case} failed on {Signal}", CandidateId, signal);
            }
        }

        public void Dispose()
        {
            if (Interlocked.Exchange(ref _disposed, 1) == 0)
            {
                bus.Remove(this);
            }
        }
    }
}
