using System.Globalization;
using System.Text;
using System.Threading.Channels;
using EventReview.Core.Records;

namespace EventReview.Data.Records;

/// <summary>
/// The witness against truncation: after each committed write batch, the newest head of every chain the batch changed
/// goes into one signed line (<see cref="WitnessLine"/>) appended to <c>record-heads.jsonl</c> in the witness folder
/// (and, when configured, posted to an HTTP endpoint by <see cref="WitnessSender"/>). Lines are signed and written by a
/// background task, off the writer's path: batches that commit while a line is being written share the next line, so
/// there is at most one line (one signature) per batch. Heads are handed over only after their commit, so the witness
/// may lag the database by the last batches after a crash but never runs ahead of it. Verification compares each
/// chain's newest witnessed head with the database: removing the newest entries is caught.
/// </summary>
public sealed class HeadWitness : IDisposable
{
    public const string FileName = "record-heads.jsonl";

    private readonly IRecordKeyRing _keys;
    private readonly TimeProvider _clock;
    private readonly Lock _gate = new();
    private readonly WitnessSender? _sender;
    private readonly Channel<IReadOnlyCollection<WitnessedHead>> _pending = Channel.CreateUnbounded<IReadOnlyCollection<WitnessedHead>>(new UnboundedChannelOptions { SingleReader = true });
    private readonly Task _loop;
    private long _queued;
    private long _written;
    private FileStream? _file;

    public HeadWitness(RecordSettings settings, IRecordKeyRing keys, TimeProvider? clock = null)
    {
        ArgumentNullException.ThrowIfNull(settings);
        Folder = settings.WitnessDirectory;
        _keys = keys;
        _clock = clock ?? TimeProvider.System;
        _sender = settings.WitnessUrl is { } url ? new WitnessSender(new Uri(url), clock) : null;
        _loop = Task.Run(LoopAsync);
    }

    public string Folder { get; }

    public string FilePath => Path.Combine(Folder, FileName);

    /// <summary>UTC time of the last successful append by this process, or null.</summary>
    public DateTimeOffset? LastAppend { get; private set; }

    /// <summary>The last append error by this process (cleared by the next success), or null.</summary>
    public string? LastError { get; private set; }

    /// <summary>The HTTP endpoint's sender, when one is configured.</summary>
    public WitnessSender? Sender => _sender;

    /// <summary>
    /// Hands over the heads of a committed batch (nothing when empty); returns at once. The line is signed and written
    /// in the background. Failures are kept in <see cref="LastError"/>, never thrown: the batch is already committed.
    /// </summary>
    public void Append(IReadOnlyCollection<WitnessedHead> heads)
    {
        if (heads.Count == 0)
        {
            return;
        }

        Interlocked.Increment(ref _queued);
        if (!_pending.Writer.TryWrite(heads))
        {
            Interlocked.Increment(ref _written); // shutting down: nothing more is written
        }
    }

    /// <summary>Waits (at most <paramref name="timeout"/>) until every batch handed over so far is in the file.</summary>
    public bool Flush(TimeSpan? timeout = null)
    {
        var target = Interlocked.Read(ref _queued);
        return SpinWait.SpinUntil(() => Interlocked.Read(ref _written) >= target, timeout ?? TimeSpan.FromSeconds(10));
    }

    private async Task LoopAsync()
    {
        while (await _pending.Reader.WaitToReadAsync())
        {
            var newest = new Dictionary<string, WitnessedHead>(StringComparer.Ordinal);
            var batches = 0;
            while (_pending.Reader.TryRead(out var heads))
            {
                batches++;
                foreach (var h in heads)
                {
                    if (!newest.TryGetValue(h.Chain, out var seen) || h.Sequence > seen.Sequence)
                    {
                        newest[h.Chain] = h;
                    }
                }
            }

            Write(newest.Values.ToList());
            Interlocked.Add(ref _written, batches);
        }
    }

    private void Write(IReadOnlyList<WitnessedHead> newest)
    {
        if (_keys.Current is not { } signer)
        {
            return;
        }

        string line;
        try
        {
            line = WitnessLine.Create(newest, _clock.GetUtcNow(), signer).ToJson();
        }
        catch (System.Security.Cryptography.CryptographicException ex)
        {
            LastError = "the record key could not sign: " + ex.Message;
            return;
        }

        lock (_gate)
        {
            try
            {
                if (_file is null)
                {
                    FileRecordKeyRing.CreatePrivateFolder(Folder);
                    _file = new FileStream(FilePath, FileMode.Append, FileAccess.Write, FileShare.ReadWrite | FileShare.Delete, 4096);
                }

                _file.Write(Encoding.UTF8.GetBytes(line + "\n"));
                _file.Flush();
                LastAppend = _clock.GetUtcNow();
                LastError = null;
            }
            catch (Exception ex) when (ex is IOException or UnauthorizedAccessException)
            {
                LastError = $"{ex.GetType().Name}: {ex.Message}";
                _file?.Dispose();
                _file = null;
            }
        }

        _sender?.Enqueue(line);
    }

    /// <summary>
    /// Reads the witness file: the newest head of each chain, with the signature of every line that gives one checked.
    /// With <paramref name="writtenBefore"/>, only lines written before that time count (what a backup taken then must hold).
    /// </summary>
    public WitnessReading Read(DateTimeOffset? writtenBefore = null)
    {
        Flush();
        return Read(FilePath, _keys, writtenBefore);
    }

    /// <summary>Reads a witness file at <paramref name="path"/> (see <see cref="Read(DateTimeOffset?)"/>).</summary>
    public static WitnessReading Read(string path, IRecordKeyRing keys, DateTimeOffset? writtenBefore = null)
    {
        var newest = new Dictionary<string, (WitnessedHead Head, string At, WitnessLine Line, long Number)>(StringComparer.Ordinal);
        var problems = new List<string>();
        if (!File.Exists(path))
        {
            return new WitnessReading(path, false, 0, null, new Dictionary<string, (WitnessedHead, string)>(), problems);
        }

        long number = 0;
        string? lastAt = null;
        string? pendingBad = null;
        using (var reader = new StreamReader(new FileStream(path, FileMode.Open, FileAccess.Read, FileShare.ReadWrite | FileShare.Delete)))
        {
            while (reader.ReadLine() is { } text)
            {
                number++;
                if (pendingBad is not null)
                {
                    problems.Add(pendingBad);
                    pendingBad = null;
                }

                if (WitnessLine.Parse(text) is not { } line)
                {
                    // A torn last line is what a crash during the append leaves; any other unreadable line is reported.
                    pendingBad = string.Create(CultureInfo.InvariantCulture, $"Witness line {number} cannot be read.");
                    continue;
                }

                if (writtenBefore is { } cutoff && DateTimeOffset.TryParse(line.At, CultureInfo.InvariantCulture, DateTimeStyles.AdjustToUniversal, out var at) && at >= cutoff)
                {
                    continue;
                }

                lastAt = line.At;
                foreach (var h in line.Heads)
                {
                    if (!newest.TryGetValue(h.Chain, out var seen) || h.Sequence >= seen.Head.Sequence)
                    {
                        newest[h.Chain] = (h, line.At, line, number);
                    }
                }
            }
        }

        foreach (var group in newest.Values.GroupBy(v => v.Number))
        {
            var first = group.First();
            if (!first.Line.SignatureValid(keys))
            {
                problems.Add(string.Create(CultureInfo.InvariantCulture, $"Witness line {first.Number} (written {first.At}) does not carry a valid signature by a listed record key; its heads are not used."));
                foreach (var v in group)
                {
                    newest.Remove(v.Head.Chain);
                }
            }
        }

        return new WitnessReading(path, true, number, lastAt is null ? null : DateTimeOffset.Parse(lastAt, CultureInfo.InvariantCulture, DateTimeStyles.AdjustToUniversal),
            newest.ToDictionary(kv => kv.Key, kv => (kv.Value.Head, kv.Value.At), StringComparer.Ordinal), problems);
    }

    private int _disposed;

    public void Dispose()
    {
        if (Interlocked.Exchange(ref _disposed, 1) == 1)
        {
            return;
        }

        _pending.Writer.TryComplete();
        _loop.Wait(TimeSpan.FromSeconds(10));
        lock (_gate)
        {
            _file?.Dispose();
            _file = null;
        }

        _sender?.Dispose();
    }
}
