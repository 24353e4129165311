using System.Collections.Concurrent;
using System.Diagnostics;
using System.Text.Json;

namespace EventReview.Load;

/// <summary>
/// The write load: each client, with its own token, opens a case and adds notes to its items round-robin, every
/// N-th write a small attachment instead of a note, and opens a fresh case after a set number of writes. Latency
/// of every write after the warm-up is kept; errors are counted by status.
/// </summary>
public static class WriteLoad
{
    public sealed record Options(Uri BaseUrl, IReadOnlyList<string> Tokens, int Clients, TimeSpan Duration, TimeSpan Warmup,
        int AttachmentEvery, int WritesPerCase, int AttachmentBytes, string Checklist, int? ServerPid);

    public sealed record Result(int Clients, double MeasuredSeconds, long Writes, double WritesPerSecond, LatencyStats Client, LatencyStats Server,
        LatencyStats Notes, LatencyStats Attachments, LatencyStats Opens, IReadOnlyDictionary<string, long> Errors, IReadOnlyList<string> ErrorSamples,
        IReadOnlyList<MemorySample> ServerMemory);

    public sealed record MemorySample(double Seconds, double Megabytes);

    public static async Task<Result> RunAsync(Options o, CancellationToken ct)
    {
        using var handler = new SocketsHttpHandler { MaxConnectionsPerServer = o.Clients * 2, PooledConnectionLifetime = TimeSpan.FromMinutes(30) };
        using var http = new HttpClient(handler) { BaseAddress = o.BaseUrl, Timeout = TimeSpan.FromSeconds(30) };
        var clock = Stopwatch.StartNew();
        var measureFrom = o.Warmup.TotalSeconds;
        var end = (o.Warmup + o.Duration).TotalSeconds;
        var errors = new ConcurrentDictionary<string, long>();
        var samples = new ConcurrentQueue<string>();
        var perClient = new List<Sample>[o.Clients];
        var run = DateTime.UtcNow.ToString("HHmmss", System.Globalization.CultureInfo.InvariantCulture);
        using var memoryStop = new CancellationTokenSource();
        var memory = new ServerMemory(o.ServerPid);
        var memoryTask = memory.RunAsync(TimeSpan.FromSeconds(5), clock, memoryStop.Token);

        var tasks = Enumerable.Range(0, o.Clients).Select(i => Task.Run(async () =>
        {
            var api = new ApiClient(http, o.Tokens[i % o.Tokens.Count]);
            var mine = perClient[i] = new List<Sample>(100_000);
            var random = new Random(i);
            var payload = new byte[o.AttachmentBytes];
            var n = 0;
            var caseNumber = 0;
            int? caseId = null;
            string[] items = [];
            var written = 0;
            while (clock.Elapsed.TotalSeconds < end && !ct.IsCancellationRequested)
            {
                ApiClient.Call call;
                string kind;
                if (caseId is null || written >= o.WritesPerCase)
                {
                    kind = "open";
                    call = await api.OpenCaseAsync($"LOAD-{run}-{i:00}-{caseNumber++:00000}", 1_400_000_000m + (i * 100_000) + caseNumber, o.Checklist, ct);
                    if (call.Status is 200 or 201 && call.Body is { } body)
                    {
                        caseId = body.GetProperty("id").GetInt32();
                        items = body.GetProperty("items").EnumerateArray().Select(x => x.GetProperty("key").GetString()!).ToArray();
                        written = 0;
                    }
                }
                else
                {
                    var item = items[n % items.Length];
                    if (o.AttachmentEvery > 0 && n % o.AttachmentEvery == o.AttachmentEvery - 1)
                    {
                        kind = "attachment";
                        random.NextBytes(payload);
                        call = await api.AttachAsync(caseId.Value, item, payload, $"load-{i}-{n}.bin", ct);
                    }
                    else
                    {
                        kind = "note";
                        call = await api.AddNoteAsync(caseId.Value, item, $"Load note {n} from client {i}: the *quick* check of `{item}` found nothing unusual.", ct);
                    }

                    n++;
                    written++;
                }

                var at = clock.Elapsed.TotalSeconds;
                if (call.Status is < 200 or >= 300)
                {
                    errors.AddOrUpdate($"{kind} {call.Status}", 1, (_, v) => v + 1);
                    if (samples.Count < 5)
                    {
                        samples.Enqueue($"{kind} {call.Status}: {call.Error}");
                    }
                }
                else if (at >= measureFrom && at < end)
                {
                    mine.Add(new Sample(kind, call.ClientMs, call.ServerMs ?? double.NaN));
                }
            }
        }, ct)).ToList();
        await Task.WhenAll(tasks);
        await memoryStop.CancelAsync();
        await memoryTask;

        var all = perClient.Where(l => l is not null).SelectMany(l => l).ToList();
        return new Result(o.Clients, o.Duration.TotalSeconds, all.Count, all.Count / o.Duration.TotalSeconds,
            LatencyStats.Of(all.Select(s => s.ClientMs).ToList()),
            LatencyStats.Of(all.Where(s => !double.IsNaN(s.ServerMs)).Select(s => s.ServerMs).ToList()),
            LatencyStats.Of(all.Where(s => s.Kind == "note").Select(s => s.ClientMs).ToList()),
            LatencyStats.Of(all.Where(s => s.Kind == "attachment").Select(s => s.ClientMs).ToList()),
            LatencyStats.Of(all.Where(s => s.Kind == "open").Select(s => s.ClientMs).ToList()),
            errors.ToDictionary(), samples.ToList(),
            memory.Samples.Select(m => new MemorySample(Math.Round(m.Seconds, 1), Math.Round(m.Bytes / 1048576.0, 1))).ToList());
    }

    private readonly record struct Sample(string Kind, double ClientMs, double ServerMs);

    public static void Print(Result r, TextWriter w)
    {
        w.WriteLine($"clients {r.Clients}, measured {r.MeasuredSeconds:0} s after warm-up");
        w.WriteLine($"writes {r.Writes:N0}  ->  {r.WritesPerSecond:N0} writes/s");
        w.WriteLine($"all writes (client): {r.Client}");
        w.WriteLine($"all writes (server): {r.Server}");
        w.WriteLine($"  notes:       {r.Notes}");
        w.WriteLine($"  attachments: {r.Attachments}");
        w.WriteLine($"  case opens:  {r.Opens}");
        w.WriteLine(r.Errors.Count == 0 ? "errors: none" : "errors: " + string.Join(", ", r.Errors.Select(e => $"{e.Key} x{e.Value}")));
        foreach (var s in r.ErrorSamples)
        {
            w.WriteLine("  " + s);
        }

        if (r.ServerMemory.Count > 0)
        {
            w.WriteLine("server RSS (MB) every 5 s: " + string.Join(" ", r.ServerMemory.Select(m => m.Megabytes.ToString("0", System.Globalization.CultureInfo.InvariantCulture))));
            var n = Math.Max(1, r.ServerMemory.Count / 5);
            var first = r.ServerMemory.Skip(n).Take(n).Average(m => m.Megabytes);
            var last = r.ServerMemory.TakeLast(n).Average(m => m.Megabytes);
            w.WriteLine($"server RSS: second fifth of the run {first:0} MB, last fifth {last:0} MB");
        }
    }

    private static readonly JsonSerializerOptions ResultJson = new(JsonSerializerDefaults.Web) { WriteIndented = true, NumberHandling = System.Text.Json.Serialization.JsonNumberHandling.AllowNamedFloatingPointLiterals };

    public static string Json(Result r) => JsonSerializer.Serialize(r, ResultJson);
}
