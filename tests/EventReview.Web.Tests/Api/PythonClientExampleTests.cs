using System.Diagnostics;
using System.Text.Json;
using EventReview.Web.Tests.Reliability;

namespace EventReview.Web.Tests.Api;

/// <summary>
/// The Python example of docs/clients.md, run as written against a running server (the app started as its own process,
/// demo seeded) with a token made by the command-line tool. Needs python3 (standard library only), as on this machine.
/// </summary>
public sealed class PythonClientExampleTests
{
    [Fact]
    public async Task The_documented_python_example_opens_a_case_adds_a_note_and_a_file_and_reads_the_verdicts()
    {
        var root = RepositoryRoot();
        var script = Path.Combine(root, "docs", "examples", "eventreview_client.py");
        var guide = await File.ReadAllTextAsync(Path.Combine(root, "docs", "clients.md"));
        Assert.Contains((await File.ReadAllTextAsync(script)).TrimEnd(), guide, StringComparison.Ordinal); // the guide shows the very file run here

        var data = Path.Combine(Path.GetTempPath(), $"er-py-{Guid.NewGuid():N}");
        try
        {
            await using var server = await ServerProcess.StartAsync(data);
            var made = await ChildProcesses.RunCliAsync(TimeSpan.FromMinutes(2), "tokens", "create", "--name", "python example", "--scope", "cases:open,evidence:add,cases:read",
                "--data", data, "--json");
            Assert.True(made.Exit == 0, made.Err + made.Out);
            var token = JsonDocument.Parse(made.Out).RootElement.GetProperty("token").GetString()!;
            var plot = Path.Combine(data, "plot.bin");
            await File.WriteAllBytesAsync(plot, [1, 2, 3, 4, 5]);

            var opened = await PythonAsync(script, server.BaseUrl, token, "open", "PY-0001", "1400000000.25", plot);
            var again = await PythonAsync(script, server.BaseUrl, token, "open", "PY-0001", "1400000000.25", plot);
            var read = await PythonAsync(script, server.BaseUrl, token, "verdicts", "ER-C-0142");
            var refused = await PythonAsync(script, server.BaseUrl, "ert_" + new string('0', 48), "verdicts", "ER-C-0142");

            Assert.True(opened.Exit == 0, opened.Err + opened.Out);
            Assert.Contains("opened (open)", opened.Out, StringComparison.Ordinal);
            Assert.Contains("note ", opened.Out, StringComparison.Ordinal);
            Assert.Contains("file plot.bin (5 bytes)", opened.Out, StringComparison.Ordinal);
            Assert.Contains("already open", again.Out, StringComparison.Ordinal);
            Assert.True(read.Exit == 0, read.Err + read.Out);
            Assert.Matches(@"timing\.arrival: .*\n\s+timing: \w+ - ", read.Out);
            Assert.NotEqual(0, refused.Exit);
            Assert.Contains("GET /api/cases?q=ER-C-0142: 401", refused.Err, StringComparison.Ordinal);
        }
        finally
        {
            Microsoft.Data.Sqlite.SqliteConnection.ClearAllPools();
            if (Directory.Exists(data))
            {
                Directory.Delete(data, recursive: true);
            }
        }
    }

    private static async Task<(int Exit, string Out, string Err)> PythonAsync(string script, string url, string token, params string[] args)
    {
        var psi = new ProcessStartInfo("python3") { RedirectStandardOutput = true, RedirectStandardError = true, UseShellExecute = false };
        psi.ArgumentList.Add(script);
        foreach (var a in args)
        {
            psi.ArgumentList.Add(a);
        }

        psi.Environment["EVENTREVIEW_URL"] = url;
        psi.Environment["EVENTREVIEW_TOKEN"] = token;
        using var p = Process.Start(psi) ?? throw new InvalidOperationException("python3 did not start.");
        var stdout = p.StandardOutput.ReadToEndAsync();
        var stderr = p.StandardError.ReadToEndAsync();
        using var cts = new CancellationTokenSource(TimeSpan.FromMinutes(2));
        await p.WaitForExitAsync(cts.Token);
        return (p.ExitCode, await stdout, await stderr);
    }

    private static string RepositoryRoot()
    {
        var dir = new DirectoryInfo(AppContext.BaseDirectory);
        while (dir is not null && !File.Exists(Path.Combine(dir.FullName, "EventReview.sln")))
        {
            dir = dir.Parent;
        }

        return dir?.FullName ?? throw new InvalidOperationException($"No EventReview.sln above {AppContext.BaseDirectory}.");
    }
}
