namespace EventReview.Load;

/// <summary>Samples the resident memory of the server process from /proc (Linux) while a run goes on.</summary>
public sealed class ServerMemory(int? pid)
{
    private readonly List<(double Seconds, long Bytes)> _samples = [];

    public IReadOnlyList<(double Seconds, long Bytes)> Samples => _samples;

    public async Task RunAsync(TimeSpan every, System.Diagnostics.Stopwatch clock, CancellationToken ct)
    {
        if (pid is null)
        {
            return;
        }

        try
        {
            while (!ct.IsCancellationRequested)
            {
                var rss = Read(pid.Value);
                if (rss is not null)
                {
                    lock (_samples)
                    {
                        _samples.Add((clock.Elapsed.TotalSeconds, rss.Value));
                    }
                }

                await Task.Delay(every, ct);
            }
        }
        catch (OperationCanceledException)
        {
        }
    }

    /// <summary>VmRSS of a process in bytes, or null when it cannot be read.</summary>
    public static long? Read(int pid)
    {
        var path = $"/proc/{pid}/status";
        if (!File.Exists(path))
        {
            return null;
        }

        foreach (var line in File.ReadLines(path))
        {
            if (line.StartsWith("VmRSS:", StringComparison.Ordinal))
            {
                var kb = long.Parse(line["VmRSS:".Length..].Trim().Split(' ')[0], System.Globalization.CultureInfo.InvariantCulture);
                return kb * 1024;
            }
        }

        return null;
    }
}
