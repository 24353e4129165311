using System.CommandLine;
using EventReview.Load;

// eventreview-load: drives a running EventReview server's HTTP API on loopback and prints what it measured.
// benchmarks/load/run.sh starts a server on a fresh data folder, creates the tokens and calls this program.
var url = new Option<string>("--url") { Description = "Base address of the server.", DefaultValueFactory = _ => "http://127.0.0.1:5300" };
var json = new Option<FileInfo?>("--json") { Description = "Also write the result as JSON to this file." };

var tokens = new Option<FileInfo>("--tokens") { Description = "File with one API token secret per line (clients use them round-robin).", Required = true };
var clients = new Option<int>("--clients") { Description = "Concurrent clients.", DefaultValueFactory = _ => 32 };
var seconds = new Option<int>("--seconds") { Description = "Measured duration in seconds (after the warm-up).", DefaultValueFactory = _ => 60 };
var warmup = new Option<int>("--warmup") { Description = "Warm-up seconds, not measured.", DefaultValueFactory = _ => 10 };
var attachEvery = new Option<int>("--attachment-every") { Description = "Every N-th write to a case is an attachment (0: never).", DefaultValueFactory = _ => 10 };
var perCase = new Option<int>("--writes-per-case") { Description = "Writes before a client opens its next case.", DefaultValueFactory = _ => 200 };
var bytes = new Option<int>("--attachment-bytes") { Description = "Size of each attachment.", DefaultValueFactory = _ => 4096 };
var checklist = new Option<string>("--checklist") { Description = "Checklist template of the cases opened.", DefaultValueFactory = _ => "candidate-review" };
var pid = new Option<int?>("--server-pid") { Description = "Process id of the server, to sample its resident memory every 5 s." };
var writes = new Command("writes", "32 clients (by default) opening cases and adding notes and attachments with tokens.")
{
    url, json, tokens, clients, seconds, warmup, attachEvery, perCase, bytes, checklist, pid,
};
writes.SetAction(async (p, ct) =>
{
    var list = File.ReadAllLines(p.GetValue(tokens)!.FullName).Select(l => l.Trim()).Where(l => l.Length > 0).ToList();
    if (list.Count == 0)
    {
        Console.Error.WriteLine("The tokens file has no token.");
        return 2;
    }

    var result = await WriteLoad.RunAsync(new WriteLoad.Options(new Uri(p.GetValue(url)!), list, p.GetValue(clients), TimeSpan.FromSeconds(p.GetValue(seconds)),
        TimeSpan.FromSeconds(p.GetValue(warmup)), p.GetValue(attachEvery), p.GetValue(perCase), p.GetValue(bytes), p.GetValue(checklist)!, p.GetValue(pid)), ct);
    WriteLoad.Print(result, Console.Out);
    if (p.GetValue(json) is { } file)
    {
        await File.WriteAllTextAsync(file.FullName, WriteLoad.Json(result), ct);
    }

    return result.Errors.Count == 0 ? 0 : 1;
});

var cases = new Option<int>("--cases") { Description = "Cases in the list.", DefaultValueFactory = _ => 10_000 };
var bigChecklist = new Option<string>("--large-checklist") { Description = "Template of the large case (40 items in benchmarks/load/checklists).", DefaultValueFactory = _ => "forty-item-review" };
var evidence = new Option<int>("--evidence-per-item") { Description = "Evidence entries per item of the large case.", DefaultValueFactory = _ => 500 };
var repeats = new Option<int>("--repeats") { Description = "Timed repeats of each request.", DefaultValueFactory = _ => 30 };
var reads = new Command("reads", "Seed many cases and one large case through the API, then time the reads.")
{
    url, json, tokens, cases, checklist, bigChecklist, evidence, repeats,
};
reads.SetAction(async (p, ct) =>
{
    var secrets = File.ReadAllLines(p.GetValue(tokens)!.FullName).Select(l => l.Trim()).Where(l => l.Length > 0).ToList();
    var results = await ReadLoad.RunAsync(new ReadLoad.Options(new Uri(p.GetValue(url)!), secrets, p.GetValue(cases), p.GetValue(checklist)!, p.GetValue(bigChecklist)!,
        p.GetValue(evidence), p.GetValue(repeats), 16), Console.Out, ct);
    ReadLoad.Print(results, Console.Out);
    if (p.GetValue(json) is { } file)
    {
        await File.WriteAllTextAsync(file.FullName, System.Text.Json.JsonSerializer.Serialize(results, new System.Text.Json.JsonSerializerOptions(System.Text.Json.JsonSerializerDefaults.Web) { WriteIndented = true }), ct);
    }

    return 0;
});

var root = new RootCommand("Load generator for the EventReview HTTP API.") { writes, reads };
return await root.Parse(args).InvokeAsync();
