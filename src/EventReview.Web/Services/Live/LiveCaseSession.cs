using System.Security.Claims;
using EventReview.Core.Live;
using EventReview.Web.Auth;

namespace EventReview.Web.Services.Live;

/// <summary>
/// One open case page's part in the live feed (lives as long as the page's circuit shows the case): the subscription
/// to the case's news, which asks the page to reload through its normal, authorised query (several news arriving during
/// one reload cause one more reload, not one each), and the page's presence (where the person is and what they are
/// doing), beaten every <see cref="PresenceBoard.BeatEvery"/> and withdrawn on <see cref="Dispose"/>. The subscription
/// is refused to anyone who may not read cases, so a notification's content (even that a case changed) never reaches them.
/// </summary>
public sealed class LiveCaseSession : IDisposable
{
    private readonly CaseBus _bus;
    private readonly string _candidateId;
    private readonly Core.Cases.Actor _me;
    private readonly Func<Task> _reload;
    private readonly Func<Task> _redraw;
    private readonly IDisposable _subscription;
    private readonly ITimer _timer;
    private readonly SemaphoreSlim _one = new(1, 1);
    private long _wanted;
    private long _done;
    private string? _itemKey;
    private string? _doing;
    private int _disposed;
    private IReadOnlyList<PresentPerson> _shown = [];

    /// <exception cref="UnauthorizedAccessException">When <paramref name="user"/> may not read cases.</exception>
    public LiveCaseSession(CaseBus bus, TimeProvider clock, string candidateId, ClaimsPrincipal user, Func<Task> reload, Func<Task> redraw)
    {
        Permissions.Require(user, Auth.Policies.Read, "follow a case live");
        _bus = bus;
        _candidateId = candidateId;
        _me = user.ToActor();
        _reload = reload;
        _redraw = redraw;
        _subscription = bus.Subscribe(candidateId, OnSignal);
        _timer = clock.CreateTimer(_ => Tick(), null, PresenceBoard.BeatEvery, PresenceBoard.BeatEvery);
        Beat();
    }

    /// <summary>This page's id on the presence board.</summary>
    public string SessionId { get; } = Guid.NewGuid().ToString("N");

    /// <summary>The page now shows <paramref name="itemKey"/> (null: no item); tells the others at once when it moved.</summary>
    public void Where(string? itemKey)
    {
        if (itemKey != _itemKey)
        {
            _itemKey = itemKey;
            _doing = null;
            Beat();
        }
    }

    /// <summary>The person is now <paramref name="doing"/> something ("editing a note"), or null when only viewing.</summary>
    public void Doing(string? doing)
    {
        if (doing != _doing)
        {
            _doing = doing;
            Beat();
        }
    }

    /// <summary>Everyone else with the case open (one line per person; where someone has several pages, the busiest counts).</summary>
    public IReadOnlyList<PresentPerson> Others() =>
        _bus.Here(_candidateId).Where(b => b.UserId != _me.UserId)
            .GroupBy(b => b.UserId)
            .Select(g => g.OrderByDescending(b => b.ItemKey == _itemKey && _itemKey is not null).ThenByDescending(b => b.Doing is not null).First())
            .Select(b => new PresentPerson(b.DisplayName, b.ItemKey, b.Doing))
            .OrderBy(p => p.DisplayName, StringComparer.Ordinal).ToList();

    /// <summary>The others who are not on the item this page shows (those are named above the item instead).</summary>
    public IReadOnlyList<PresentPerson> OthersElsewhere() => _itemKey is null ? Others() : Others().Where(p => p.ItemKey != _itemKey).ToList();

    /// <summary>The others on the item this page shows.</summary>
    public IReadOnlyList<PresentPerson> OthersHere() => _itemKey is null ? [] : Others().Where(p => p.ItemKey == _itemKey).ToList();

    public void Dispose()
    {
        if (Interlocked.Exchange(ref _disposed, 1) != 0)
        {
            return;
        }

        _subscription.Dispose();
        _timer.Dispose();
        _bus.Beat(Current(leaving: true));
    }

    private PresenceBeat Current(bool leaving = false) => new(_candidateId, SessionId, _me.UserId, _me.DisplayName, _itemKey, _doing, leaving);

    private void Beat()
    {
        if (Volatile.Read(ref _disposed) == 0)
        {
            _bus.Beat(Current());
        }
    }

    private void Tick()
    {
        Beat();
        // Someone may have gone quiet (expired) without a word: redraw who is here. A page already gone is no matter.
        _ = RedrawPresenceAsync().ContinueWith(t => _ = t.Exception, TaskContinuationOptions.OnlyOnFaulted);
    }

    private Task OnSignal(LiveSignal signal) => signal == LiveSignal.CaseChanged ? ReloadAsync() : RedrawPresenceAsync();

    /// <summary>Redraws only when what this page shows of the others changed (not for its own beats or mere renewals).</summary>
    private Task RedrawPresenceAsync()
    {
        var others = Others();
        if (others.SequenceEqual(Volatile.Read(ref _shown)))
        {
            return Task.CompletedTask;
        }

        Volatile.Write(ref _shown, others);
        return Safe(_redraw);
    }

    private Task ReloadAsync()
    {
        Interlocked.Increment(ref _wanted);
        return DrainAsync();
    }

    private async Task DrainAsync()
    {
        if (!await _one.WaitAsync(0))
        {
            return; // the running reload picks this one up
        }

        try
        {
            while (Volatile.Read(ref _disposed) == 0 && Interlocked.Read(ref _done) < Interlocked.Read(ref _wanted))
            {
                Interlocked.Exchange(ref _done, Interlocked.Read(ref _wanted));
                await _reload();
            }
        }
        finally
        {
            _one.Release();
        }

        // News that came between the last check and the release would otherwise wait for the next one.
        if (Volatile.Read(ref _disposed) == 0 && Interlocked.Read(ref _done) < Interlocked.Read(ref _wanted))
        {
            await DrainAsync();
        }
    }

    private async Task Safe(Func<Task> work)
    {
        if (Volatile.Read(ref _disposed) == 0)
        {
            await work();
        }
    }
}
