using System.Collections.Concurrent;
using System.Net;
using System.Net.Http.Headers;
using System.Net.Http.Json;
using System.Text.Json;
using EventReview.Core.Evidence;
using EventReview.Data;
using EventReview.Web.Tests.Fixtures;
using Microsoft.EntityFrameworkCore;

namespace EventReview.Web.Tests.Reliability;

/// <summary>
/// Crash safety of evidence uploads: the real server (a child process) is killed with SIGKILL in the middle of a burst
/// of concurrent attachment uploads through the API; after a restart on the same data folder every upload that was
/// acknowledged with 201 is in the record and its file verifies, SQLite's integrity check passes and the whole record
/// verifies (<see cref="IntegrityVerifier"/> and <c>eventreview verify</c>). Every loop is bounded in count and time.
/// </summary>
public sealed class KillDuringUploadsTests(Xunit.Abstractions.ITestOutputHelper output) : IDisposable
{
    private const int Uploads = 40;
    private const int Parallel = 8;
    private const int KillAfterAcknowledged = 10;
    private const string ItemKey = "triage.timing";

    private static readonly TimeSpan CliTimeout = TimeSpan.FromMinutes(3);

    private readonly string _dir = Directory.CreateDirectory(Path.Combine(Path.GetTempPath(), $"er-crash-{Guid.NewGuid():N}")).FullName;

    public void Dispose()
    {
        Microsoft.Data.Sqlite.SqliteConnection.ClearAllPools();
        try
        {
            Directory.Delete(_dir, recursive: true);
        }
        catch (IOException)
        {
        }
    }

    private sealed record Acknowledged(int Index, string Sha256, long SizeBytes);

    private static HttpClient Client(string baseUrl, string token)
    {
        var client = new HttpClient { BaseAddress = new Uri(baseUrl), Timeout = TimeSpan.FromSeconds(90) };
        client.DefaultRequestHeaders.Authorization = new AuthenticationHeaderValue("Bearer", token);
        return client;
    }

    private async Task<string> CreateTokenAsync()
    {
        var (exit, json, error) = await ChildProcesses.RunCliAsync(CliTimeout, "tokens", "create", "--name", "crash test", "--scope", "cases:read,cases:open,evidence:add", "--data", _dir, "--json");
        Assert.True(exit == 0, $"tokens create exited {exit}: {error}");
        return JsonDocument.Parse(json).RootElement.GetProperty("token").GetString()!;
    }

    private static async Task<int> OpenCaseAsync(HttpClient client)
    {
        using var response = await client.PostAsJsonAsync("/api/cases", ApiCalls.OpenCaseBody(ApiCalls.NewCandidateId()));
        Assert.Equal(HttpStatusCode.Created, response.StatusCode);
        return (await response.JsonAsync())["id"]!.GetValue<int>();
    }

    private static MultipartFormDataContent Form(byte[] bytes, string fileName)
    {
        var form = new MultipartFormDataContent();
        var file = new ByteArrayContent(bytes);
        file.Headers.ContentType = new MediaTypeHeaderValue("application/octet-stream");
        form.Add(file, "file", fileName);
        return form;
    }

    [Fact]
    [Trait("Speed", "Slow")] // about a minute: skip with --filter "Speed!=Slow" while working; ./test.sh (and so CI) runs it
    public async Task Every_upload_acknowledged_before_a_sigkill_is_in_the_record_after_a_restart_and_everything_verifies()
    {
        var token = await CreateTokenAsync();
        var random = new Random(20261202);
        var files = Enumerable.Range(0, Uploads).Select(_ =>
        {
            var bytes = new byte[random.Next(512, 24 * 1024)];
            random.NextBytes(bytes);
            return bytes;
        }).ToList();

        var acknowledged = new ConcurrentBag<Acknowledged>();
        var outcomes = new ConcurrentBag<string>();
        var killNow = new TaskCompletionSource(TaskCreationOptions.RunContinuationsAsynchronously);
        int caseId;
        await using (var server = await ServerProcess.StartAsync(_dir))
        {
            using var client = Client(server.BaseUrl, token);
            caseId = await OpenCaseAsync(client);
            using var gate = new SemaphoreSlim(Parallel);
            var uploads = files.Select(async (bytes, i) =>
            {
                await gate.WaitAsync();
                try
                {
                    // Uploads keep going until the server is gone, so that several are in flight when it is killed.
                    using var response = await client.PostAsync($"/api/cases/{caseId}/items/{ItemKey}/attachments", Form(bytes, $"burst-{i:D2}.bin"));
                    outcomes.Add(((int)response.StatusCode).ToString(System.Globalization.CultureInfo.InvariantCulture));
                    if (response.StatusCode == HttpStatusCode.Created)
                    {
                        var json = await response.JsonAsync();
                        acknowledged.Add(new Acknowledged(i, (string)json["sha256"]!, (long)json["sizeBytes"]!));
                        if (acknowledged.Count >= KillAfterAcknowledged)
                        {
                            killNow.TrySetResult();
                        }
                    }
                }
                catch (Exception ex) when (ex is HttpRequestException or TaskCanceledException or IOException or JsonException)
                {
                    outcomes.Add("failed: " + ex.GetType().Name);
                }
                finally
                {
                    gate.Release();
                }
            }).ToList();

            // Kill once enough uploads were acknowledged (or, bounded, when the burst ended or took too long).
            await Task.WhenAny(killNow.Task, Task.WhenAll(uploads), Task.Delay(TimeSpan.FromMinutes(5)));
            await server.KillAsync();
            Assert.True(await Task.WhenAny(Task.WhenAll(uploads), Task.Delay(TimeSpan.FromMinutes(3))) is Task t && t.IsCompleted, "uploads did not end after the kill");
        }

        var acked = acknowledged.ToList();
        output.WriteLine($"{acked.Count} of {Uploads} uploads acknowledged before the kill; outcomes: " +
            string.Join(", ", outcomes.GroupBy(o => o).OrderBy(g => g.Key, StringComparer.Ordinal).Select(g => $"{g.Key} x{g.Count()}")));
        Assert.True(acked.Count > 0, "no upload was acknowledged before the kill: " + string.Join(", ", outcomes));
        Assert.All(acked, a => Assert.Equal(Hashing.Sha256Hex(files[a.Index]), a.Sha256));

        // Restart on the same folder: the app starts, shows every acknowledged file and accepts new evidence.
        await using (var server = await ServerProcess.StartAsync(_dir))
        {
            using var client = Client(server.BaseUrl, token);
            var item = (await (await client.GetAsync($"/api/cases/{caseId}")).JsonAsync())["items"]!.AsArray().Single(i => (string?)i!["key"] == ItemKey)!;
            Assert.True(item["evidenceCount"]!.GetValue<int>() >= acked.Count, $"evidence {item["evidenceCount"]} < acknowledged {acked.Count}");
            foreach (var a in acked)
            {
                var bytes = await client.GetByteArrayAsync($"/files/{a.Sha256}");
                Assert.Equal(a.Sha256, Hashing.Sha256Hex(bytes));
            }

            using var after = await client.PostAsync($"/api/cases/{caseId}/items/{ItemKey}/attachments", Form("after the restart"u8.ToArray(), "after.txt"));
            Assert.Equal(HttpStatusCode.Created, after.StatusCode);
        }

        var settings = DatabaseSettings.ForSqlite(_dir);
        using var records = EventReview.Data.Records.RecordKeeping.Open(EventReview.Data.Records.RecordSettings.ForDataDirectory(_dir));
        var factory = new AppDbContextFactory(settings, records);
        var store = new AttachmentStore(settings);
        await using (var db = factory.CreateDbContext())
        {
            var c = await db.CasesWithEverything().AsNoTracking().SingleAsync(x => x.Id == caseId);
            var stored = c.Item(ItemKey).Evidence.Select(e => e.ContentSha256).ToList();
            Assert.All(acked, a => Assert.Contains(a.Sha256, stored));
            Assert.All(acked, a => Assert.True(store.Verify(a.Sha256), $"file {a.Sha256} does not verify on disk"));

            var connection = db.Database.GetDbConnection();
            await connection.OpenAsync();
            await using var check = connection.CreateCommand();
            check.CommandText = "PRAGMA integrity_check;";
            Assert.Equal("ok", (string?)await check.ExecuteScalarAsync());
        }

        var (cases, database) = await new IntegrityVerifier(factory, store, settings, records).VerifyAsync();
        Assert.Empty(database);
        Assert.All(cases, c => Assert.True(c.Valid, $"{c.CandidateId}: {string.Join("; ", c.Problems.Select(p => p.What))}"));
        Microsoft.Data.Sqlite.SqliteConnection.ClearAllPools();

        var (exit, json, error) = await ChildProcesses.RunCliAsync(CliTimeout, "verify", "--data", _dir, "--json");
        Assert.True(exit == 0, $"eventreview verify exited {exit}: {json} {error}");
        var result = JsonDocument.Parse(json).RootElement;
        Assert.True(result.GetProperty("valid").GetBoolean());
        Assert.Equal(0, result.GetProperty("problems").GetArrayLength());
    }
}
