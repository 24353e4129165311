using EventReview.Core.Cases;
using EventReview.Core.Records;
using EventReview.Data.Auth;

namespace EventReview.Data.Records;

/// <summary>
/// The record key ring and the witness of one installation, used by every writer: new timeline and sign-in audit
/// entries are signed (MAC) before they are stored, and the heads of the chains a committed batch changed go to the
/// witness. Verification reads both.
/// </summary>
public sealed class RecordKeeping(RecordSettings settings, IRecordKeyRing keys, HeadWitness witness) : IDisposable
{
    public RecordSettings Settings { get; } = settings;

    public IRecordKeyRing Keys { get; } = keys;

    public HeadWitness Witness { get; } = witness;

    private readonly Lock _observersLock = new();
    private Action<IReadOnlyCollection<WitnessedHead>>[] _observers = [];

    /// <summary>
    /// Every writer calls this once a unit has committed, and only then (never for a save that failed or rolled back),
    /// with the heads of the chains it wrote: they go to the witness and to the observers (the live case feed), which
    /// must return at once and are never allowed to fail the write.
    /// </summary>
    public void Committed(IReadOnlyCollection<WitnessedHead> heads)
    {
        if (heads.Count == 0)
        {
            return;
        }

        Witness.Append(heads);
        foreach (var observer in Volatile.Read(ref _observers))
        {
            try
            {
                observer(heads);
            }
            catch (Exception)
            {
                // An observer's failure must not touch a write that is already committed.
            }
        }
    }

    /// <summary>Adds an observer of committed heads (see <see cref="Committed"/>); dispose the result to remove it.</summary>
    public IDisposable ObserveCommits(Action<IReadOnlyCollection<WitnessedHead>> observer)
    {
        lock (_observersLock)
        {
            _observers = [.. _observers, observer];
        }

        return new Unobserve(this, observer);
    }

    private sealed class Unobserve(RecordKeeping owner, Action<IReadOnlyCollection<WitnessedHead>> observer) : IDisposable
    {
        public void Dispose()
        {
            lock (owner._observersLock)
            {
                owner._observers = owner._observers.Where(o => o != observer).ToArray();
            }
        }
    }

    /// <summary>Opens the key folder and the witness named by <paramref name="settings"/> (no key is created here).</summary>
    public static RecordKeeping Open(RecordSettings settings, TimeProvider? clock = null)
    {
        var keys = FileRecordKeyRing.Open(settings.KeyDirectory);
        return new RecordKeeping(settings, keys, new HeadWitness(settings, keys, clock));
    }

    /// <summary>Signs a new timeline entry (when a signing key is present) and returns its head for the witness.</summary>
    public WitnessedHead Sign(TimelineEntry entry)
    {
        if (entry.KeyId is null && Keys.Current is { } signer)
        {
            entry.Authenticate(signer);
        }

        return new WitnessedHead(entry.Chain, entry.Sequence, entry.Hash);
    }

    /// <summary>Signs a new sign-in audit entry and returns its head for the witness.</summary>
    public WitnessedHead Sign(AccountEvent entry)
    {
        if (entry.KeyId is null && Keys.Current is { } signer)
        {
            entry.Authenticate(signer);
        }

        return new WitnessedHead(EntryMac.AuditChain, entry.Sequence, entry.Hash);
    }

    public void Dispose()
    {
        Witness.Dispose();
        (Keys as IDisposable)?.Dispose();
    }
}
