using System.Collections.Concurrent;
using System.Security.Claims;
using EventReview.Core.Live;
using EventReview.Core.Records;
using EventReview.Data.Records;
using EventReview.Web.Services.Live;
using EventReview.Web.Tests.Fixtures;
using Microsoft.Extensions.Logging;

namespace EventReview.Web.Tests.Services.Live;

/// <summary>The in-process live bus: committed heads in, "this case changed" out; the relay's payloads; presence.</summary>
public sealed class CaseBusTests : IDisposable
{
    private static readonly TimeSpan Wait = TimeSpan.FromSeconds(10);
    private readonly Logs _log = new();
    private readonly Relay _relay = new();
    private readonly CaseBus _bus;

    public CaseBusTests()
    {
        _bus = new CaseBus(TimeProvider.System, _log);
        _bus.UseRelay(_relay);
    }

    public void Dispose() => _bus.Dispose();

    [Fact]
    public async Task A_committed_case_head_reaches_that_cases_subscribers_only_and_goes_to_the_relay_as_ids()
    {
        var demo = Listen("DEMO-1");
        var other = Listen("OTHER-2");

        _bus.Committed([new WitnessedHead(EntryMac.CaseChain("DEMO-1"), 7, "h7"), new WitnessedHead(EntryMac.CaseChain("DEMO-1"), 8, "h8"),
            new WitnessedHead(EntryMac.AuditChain, 3, "a3")]);

        Assert.Equal(LiveSignal.CaseChanged, await demo.Reader.ReadAsync().AsTask().WaitAsync(Wait));
        Assert.Equal(LivePayload.Format(_bus.Origin, new CaseChanged("DEMO-1", 8)), Assert.Single(_relay.Sent));
        await Task.Delay(200);
        Assert.False(other.Reader.TryRead(out _));
        Assert.False(demo.Reader.TryRead(out _));
    }

    [Fact]
    public async Task The_record_keepings_commits_feed_the_bus_and_a_disposed_subscription_hears_nothing_more()
    {
        var folder = Path.Combine(Path.GetTempPath(), $"er-live-{Guid.NewGuid():N}");
        using var records = RecordKeeping.Open(RecordSettings.ForDataDirectory(folder));
        using var bus = new CaseBus(TimeProvider.System, _log, records);
        var heard = System.Threading.Channels.Channel.CreateUnbounded<LiveSignal>();
        var subscription = bus.Subscribe("DEMO-1", s => heard.Writer.WriteAsync(s).AsTask());

        records.Committed([new WitnessedHead(EntryMac.CaseChain("DEMO-1"), 2, "h2")]);
        Assert.Equal(LiveSignal.CaseChanged, await heard.Reader.ReadAsync().AsTask().WaitAsync(Wait));

        subscription.Dispose();
        Assert.Equal(0, bus.SubscriberCount);
        records.Committed([new WitnessedHead(EntryMac.CaseChain("DEMO-1"), 3, "h3")]);
        await Task.Delay(200);
        Assert.False(heard.Reader.TryRead(out _));
        if (Directory.Exists(folder))
        {
            Directory.Delete(folder, recursive: true);
        }
    }

    [Fact]
    public async Task A_malformed_payload_from_the_channel_is_logged_and_ignored_and_the_next_good_one_still_arrives()
    {
        var demo = Listen("DEMO-1");

        var bad = _bus.Receive("{\"v\":1,\"o\":\"other\",\"t\":\"change\",\"case\":\"DEMO-1\",\"seq\":-4}");
        _bus.Receive("\u0000garbage");
        _bus.Receive(null);

        Assert.False(bad.Ok);
        Assert.Equal(3, _log.Warnings.Count);
        Assert.Contains("sequence", _log.Warnings.First(), StringComparison.Ordinal);
        _bus.Receive(LivePayload.Format("other-instance", new CaseChanged("DEMO-1", 5)));
        Assert.Equal(LiveSignal.CaseChanged, await demo.Reader.ReadAsync().AsTask().WaitAsync(Wait));
        await Task.Delay(200);
        Assert.False(demo.Reader.TryRead(out _));
    }

    [Fact]
    public async Task The_instances_own_messages_coming_back_from_the_channel_are_skipped()
    {
        var demo = Listen("DEMO-1");

        _bus.Receive(LivePayload.Format(_bus.Origin, new CaseChanged("DEMO-1", 5)));

        await Task.Delay(200);
        Assert.False(demo.Reader.TryRead(out _));
    }

    [Fact]
    public async Task A_failing_subscriber_is_logged_and_does_not_keep_the_others_from_hearing()
    {
        using var failing = _bus.Subscribe("DEMO-1", _ => throw new InvalidOperationException("page gone"));
        var demo = Listen("DEMO-1");

        _bus.Committed([new WitnessedHead(EntryMac.CaseChain("DEMO-1"), 2, "h2")]);

        Assert.Equal(LiveSignal.CaseChanged, await demo.Reader.ReadAsync().AsTask().WaitAsync(Wait));
        await WaitUntil(() => _log.Warnings.Any(w => w.Contains("DEMO-1", StringComparison.Ordinal)));
    }

    [Fact]
    public async Task Presence_from_this_instance_and_from_another_is_shown_relayed_and_withdrawn()
    {
        var demo = Listen("DEMO-1");

        _bus.Beat(new PresenceBeat("DEMO-1", "s-ana", "u-ana", "Ana Example", "3.2", null));
        Assert.Equal(LiveSignal.PresenceChanged, await demo.Reader.ReadAsync().AsTask().WaitAsync(Wait));
        Assert.Contains("\"t\":\"here\"", Assert.Single(_relay.Sent), StringComparison.Ordinal);

        _bus.Receive(LivePayload.Format("other-instance", new PresenceBeat("DEMO-1", "s-ben", "u-ben", "Ben Example", "3.2", "editing a note")));
        Assert.Equal(LiveSignal.PresenceChanged, await demo.Reader.ReadAsync().AsTask().WaitAsync(Wait));
        Assert.Equal(["Ana Example", "Ben Example"], _bus.Here("DEMO-1").Select(b => b.DisplayName));

        _bus.Receive(LivePayload.Format("other-instance", new PresenceBeat("DEMO-1", "s-ben", "u-ben", "Ben Example", "3.2", null, Leaving: true)));
        Assert.Equal(LiveSignal.PresenceChanged, await demo.Reader.ReadAsync().AsTask().WaitAsync(Wait));
        Assert.Equal(["Ana Example"], _bus.Here("DEMO-1").Select(b => b.DisplayName));
    }

    [Fact]
    public async Task A_page_session_sees_the_others_on_its_item_not_itself_and_withdraws_when_disposed()
    {
        var ana = Principals.Reviewer("u-ana", "Ana Example");
        var ben = Principals.Reviewer("u-ben", "Ben Example");
        var reloads = 0;
        using var anaPage = new LiveCaseSession(_bus, TimeProvider.System, "DEMO-1", ana, () => { Interlocked.Increment(ref reloads); return Task.CompletedTask; }, () => Task.CompletedTask);
        var benPage = new LiveCaseSession(_bus, TimeProvider.System, "DEMO-1", ben, () => Task.CompletedTask, () => Task.CompletedTask);
        anaPage.Where("3.2");
        benPage.Where("3.2");
        benPage.Doing("editing a note");

        Assert.Equal("Ben Example (editing a note)", Assert.Single(anaPage.OthersHere()).Label);
        Assert.Equal("Ana Example", Assert.Single(benPage.OthersHere()).Label);
        benPage.Where("4.1");
        Assert.Empty(anaPage.OthersHere());
        Assert.Equal("4.1", Assert.Single(anaPage.Others()).ItemKey);

        benPage.Dispose();
        Assert.Empty(anaPage.Others());
        _bus.Committed([new WitnessedHead(EntryMac.CaseChain("DEMO-1"), 9, "h9")]);
        await WaitUntil(() => Volatile.Read(ref reloads) == 1);
    }

    [Fact]
    public void Someone_who_may_not_read_cases_gets_no_subscription()
    {
        var nobody = new ClaimsPrincipal(new ClaimsIdentity());

        Assert.Throws<UnauthorizedAccessException>(() => new LiveCaseSession(_bus, TimeProvider.System, "DEMO-1", nobody, () => Task.CompletedTask, () => Task.CompletedTask));
        Assert.Equal(0, _bus.SubscriberCount);
    }

    [Fact]
    public void A_channel_name_that_is_not_a_plain_identifier_is_refused()
    {
        Assert.Equal("eventreview_live", PostgresLiveRelay.ValidChannel("eventreview_live"));
        Assert.Throws<ArgumentException>(() => PostgresLiveRelay.ValidChannel("live; DROP TABLE x"));
        Assert.Throws<ArgumentException>(() => PostgresLiveRelay.ValidChannel("Live"));
    }

    private System.Threading.Channels.Channel<LiveSignal> Listen(string candidateId)
    {
        var channel = System.Threading.Channels.Channel.CreateUnbounded<LiveSignal>();
        _bus.Subscribe(candidateId, s => channel.Writer.WriteAsync(s).AsTask());
        return channel;
    }

    private static async Task WaitUntil(Func<bool> condition)
    {
        var until = DateTime.UtcNow + Wait;
        while (!condition())
        {
            Assert.True(DateTime.UtcNow < until, "the condition did not become true in time");
            await Task.Delay(20);
        }
    }

    private sealed class Relay : ILiveRelay
    {
        public ConcurrentQueue<string> Sent { get; } = new();

        public void Send(string payload) => Sent.Enqueue(payload);
    }

    private sealed class Logs : ILogger<CaseBus>
    {
        public ConcurrentQueue<string> Warnings { get; } = new();

        public IDisposable? BeginScope<TState>(TState state) where TState : notnull => null;

        public bool IsEnabled(LogLevel logLevel) => true;

        public void Log<TState>(LogLevel logLevel, EventId eventId, TState state, Exception? exception, Func<TState, Exception?, string> formatter)
        {
            if (logLevel == LogLevel.Warning)
            {
                Warnings.Enqueue(formatter(state, exception));
            }
        }
    }
}
