using System.Diagnostics;

namespace EventReview.Load;

/// <summary>
/// The read measurements: seeds (through the API) a given number of cases and one large case with many items and
/// many evidence entries per item, then times the case list (first and last page, search), the large case, one
/// page of an item's evidence and one page of its timeline. Times are the server's own (Server-Timing) and the client's.
/// </summary>
public static class ReadLoad
{
    public sealed record Options(Uri BaseUrl, IReadOnlyList<string> Tokens, int Cases, string CaseChecklist, string BigChecklist, int EvidencePerItem, int Repeats, int SeedParallelism);

    public sealed record Measurement(string What, string Path, LatencyStats Server, LatencyStats Client, long ResponseBytes);

    public static async Task<IReadOnlyList<Measurement>> RunAsync(Options o, TextWriter log, CancellationToken ct)
    {
        using var http = new HttpClient(new SocketsHttpHandler { MaxConnectionsPerServer = 64 }) { BaseAddress = o.BaseUrl, Timeout = TimeSpan.FromMinutes(2) };
        var apis = o.Tokens.Select(t => new ApiClient(http, t)).ToList();
        var api = apis[0];
        var clock = Stopwatch.StartNew();

        var existing = await api.GetAsync("/api/cases?limit=1", ct);
        var total = existing.Status == 200 && existing.Body is { } b && b.TryGetProperty("total", out var t) ? t.GetInt32() : 0;
        if (total < o.Cases)
        {
            log.WriteLine($"seeding {o.Cases - total:N0} cases ({o.CaseChecklist}) ...");
            var next = total;
            await Parallel.ForEachAsync(Enumerable.Range(total, o.Cases - total), new ParallelOptions { MaxDegreeOfParallelism = o.SeedParallelism, CancellationToken = ct }, async (k, token) =>
            {
                var call = await Seed(() => apis[k % apis.Count].OpenCaseAsync($"READ-{k:000000}", 1_300_000_000m + (k * 37m), o.CaseChecklist, token), token);
                if (call.Status is not (200 or 201))
                {
                    throw new InvalidOperationException($"opening case {k} failed: {call.Status} {call.Error}");
                }

                if (Interlocked.Increment(ref next) % 2000 == 0)
                {
                    log.WriteLine($"  {next:N0} cases ({clock.Elapsed.TotalSeconds:0} s)");
                }
            });
        }

        var big = await api.OpenCaseAsync("READ-LARGE", 1_299_000_000m, o.BigChecklist, ct);
        var bigId = big.Body!.Value.GetProperty("id").GetInt32();
        var items = big.Body!.Value.GetProperty("items").EnumerateArray()
            .Select(x => (Key: x.GetProperty("key").GetString()!, Count: x.GetProperty("evidenceCount").GetInt32())).ToList();
        var missing = items.Sum(i => Math.Max(0, o.EvidencePerItem - i.Count));
        if (missing > 0)
        {
            log.WriteLine($"seeding {missing:N0} notes into case READ-LARGE ({items.Count} items x {o.EvidencePerItem}) ...");
            var work = items.SelectMany(i => Enumerable.Range(i.Count, Math.Max(0, o.EvidencePerItem - i.Count)).Select(n => (i.Key, n))).ToList();
            await Parallel.ForEachAsync(work, new ParallelOptions { MaxDegreeOfParallelism = o.SeedParallelism, CancellationToken = ct }, async (w, token) =>
            {
                var call = await Seed(() => apis[w.n % apis.Count].AddNoteAsync(bigId, w.Key, $"Seeded note {w.n} on `{w.Key}`.", token), token);
                if (call.Status != 201)
                {
                    throw new InvalidOperationException($"note {w.n} on {w.Key} failed: {call.Status} {call.Error}");
                }
            });
        }

        log.WriteLine($"seeded in {clock.Elapsed.TotalSeconds:0} s; measuring ({o.Repeats} repeats each) ...");
        var first = items[0].Key;
        var probes = new (string What, string Path)[]
        {
            ("case list, first page (50)", "/api/cases?limit=50"),
            ("case list, last page (50)", $"/api/cases?limit=50&offset={Math.Max(0, o.Cases - 50)}"),
            ("case list, text search", "/api/cases?q=READ-00123&limit=50"),
            ("case list, state filter", "/api/cases?state=open&limit=50"),
            ($"large case ({items.Count} items, {o.EvidencePerItem} evidence each)", $"/api/cases/{bigId}"),
            ("large case, one item's evidence, first page (50)", $"/api/cases/{bigId}/items/{first}/evidence?limit=50"),
            ("large case, one item's evidence, last page (50)", $"/api/cases/{bigId}/items/{first}/evidence?limit=50&offset={Math.Max(0, o.EvidencePerItem - 50)}"),
            ("large case, timeline, newest page (100)", $"/api/cases/{bigId}/timeline?limit=100"),
        };

        var results = new List<Measurement>();
        foreach (var (what, path) in probes)
        {
            var server = new List<double>();
            var client = new List<double>();
            long size = 0;
            for (var r = 0; r < o.Repeats + 2; r++)
            {
                var call = await api.GetAsync(path, ct);
                if (call.Status != 200)
                {
                    throw new InvalidOperationException($"GET {path} answered {call.Status}: {call.Error}");
                }

                size = call.Body?.GetRawText().Length ?? 0;
                if (r >= 2)
                {
                    // The first two calls warm caches and the JIT; they are not counted.
                    client.Add(call.ClientMs);
                    server.Add(call.ServerMs ?? double.NaN);
                }
            }

            results.Add(new Measurement(what, path, LatencyStats.Of(server), LatencyStats.Of(client), size));
        }

        return results;
    }

    // Seeding respects the server's rate limits: on 429 it waits as told (Retry-After) and sends again.
    private static async Task<ApiClient.Call> Seed(Func<Task<ApiClient.Call>> send, CancellationToken ct)
    {
        while (true)
        {
            var call = await send();
            if (call.Status != 429)
            {
                return call;
            }

            await Task.Delay(TimeSpan.FromSeconds(1), ct);
        }
    }

    public static void Print(IReadOnlyList<Measurement> results, TextWriter w)
    {
        foreach (var m in results)
        {
            w.WriteLine($"{m.What}: server p50 {m.Server.P50Ms:0.0} ms, p99 {m.Server.P99Ms:0.0} ms, max {m.Server.MaxMs:0.0} ms; client p50 {m.Client.P50Ms:0.0} ms; {m.ResponseBytes / 1024.0:0.0} KiB");
        }
    }
}
