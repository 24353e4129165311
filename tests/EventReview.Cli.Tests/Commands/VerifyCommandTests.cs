using System.IO.Compression;
using System.Text.Json;
using EventReview.Cli.Commands;
using EventReview.Data;
using Microsoft.EntityFrameworkCore;

namespace EventReview.Cli.Tests.Commands;

/// <summary>
/// <c>eventreview verify --data DIR --json</c> and <c>dossier export</c> / <c>dossier verify</c> on a real data folder
/// (SQLite file and attachment folder) holding the sample case, before and after an intruder changes it.
/// </summary>
[Collection("Console")]
public sealed class VerifyCommandTests : IAsyncLifetime
{
    private readonly string _dir = Path.Combine(Path.GetTempPath(), "er-cli-verify-" + Guid.NewGuid().ToString("N"));
    private int _caseId;
    private string _candidate = string.Empty;

    public async Task InitializeAsync()
    {
        var settings = DatabaseSettings.ForSqlite(_dir);
        var factory = new AppDbContextFactory(settings, CliRecords.For(_dir));
        await DatabaseInitializer.MigrateAsync(factory);
        await new AttachmentStore(settings).SaveAsync(new MemoryStream(SampleCase.AttachmentBytes), 1024);
        var c = SampleCase.Build(freezeInTimeline: false).Case;
        await using var db = factory.CreateDbContext();
        db.Cases.Add(c);
        await db.SaveChangesAsync();
        (_caseId, _candidate) = (c.Id, c.CandidateId);
    }

    public Task DisposeAsync()
    {
        Microsoft.Data.Sqlite.SqliteConnection.ClearAllPools();
        try
        {
            Directory.Delete(_dir, recursive: true);
        }
        catch (IOException)
        {
        }

        return Task.CompletedTask;
    }

    private async Task IntrudeAsync(params string[] statements)
    {
        await using var db = new AppDbContextFactory(DatabaseSettings.ForSqlite(_dir)).CreateDbContext();
        foreach (var sql in statements)
        {
            await db.Database.ExecuteSqlRawAsync(sql);
        }

        Microsoft.Data.Sqlite.SqliteConnection.ClearAllPools();
    }

    private static JsonElement Json(string output) => JsonDocument.Parse(output).RootElement;

    [Fact]
    public void A_clean_folder_verifies_with_exit_0_and_valid_true()
    {
        var (code, output, error) = CliRunner.Run(VerifyCommand.Build(), "verify", "--data", _dir, "--json");

        Assert.True(code == 0, error);
        var json = Json(output);
        Assert.True(json.GetProperty("valid").GetBoolean());
        Assert.Equal(0, json.GetProperty("problems").GetArrayLength());
    }

    [Fact]
    public void A_clean_folder_prints_valid_with_the_counts_in_text_mode()
    {
        var (code, output, _) = CliRunner.Run(VerifyCommand.Build(), "verify", "--data", _dir, "--case", _caseId.ToString(System.Globalization.CultureInfo.InvariantCulture));

        Assert.Equal(0, code);
        var lines = output.Trim().Split('\n');
        Assert.StartsWith("record key ", lines[0], StringComparison.Ordinal);
        Assert.Contains("(current, from ", lines[0], StringComparison.Ordinal);
        Assert.StartsWith("witness " + Path.Combine(_dir, "witness", "record-heads.jsonl"), lines[1], StringComparison.Ordinal);
        Assert.StartsWith("valid (1 case(s), ", lines[^1], StringComparison.Ordinal);
    }

    [Fact]
    public async Task An_altered_note_gives_exit_1_and_a_json_problem_naming_the_case_item_and_what()
    {
        await IntrudeAsync("DROP TRIGGER er_Evidence_no_update;",
            "UPDATE \"Evidence\" SET \"Text\" = 'Delay is fine.' WHERE \"Text\" LIKE 'Delay is **4.6 ms**%'");

        var (code, output, _) = CliRunner.Run(VerifyCommand.Build(), "verify", "--data", _dir, "--json");

        Assert.Equal(1, code);
        var json = Json(output);
        Assert.False(json.GetProperty("valid").GetBoolean());
        var problems = json.GetProperty("problems").EnumerateArray().ToList();
        Assert.All(problems, p => Assert.Equal((_candidate, "timing.delay"), (p.GetProperty("case").GetString(), p.GetProperty("item").GetString())));
        var p = Assert.Single(problems, p => p.GetProperty("what").GetString()!.Contains("text no longer matches its SHA-256", StringComparison.Ordinal));
        Assert.Equal(JsonValueKind.Null, p.GetProperty("entry").ValueKind);
    }

    [Fact]
    public async Task An_altered_timeline_entry_gives_exit_1_and_names_the_entry_in_json_and_text()
    {
        await IntrudeAsync("DROP TRIGGER er_Timeline_no_update;",
            "UPDATE \"Timeline\" SET \"ActorName\" = 'Somebody Else' WHERE \"Sequence\" = 2");

        var (code, output, _) = CliRunner.Run(VerifyCommand.Build(), "verify", "--data", _dir, "--json");
        var (textCode, text, _) = CliRunner.Run(VerifyCommand.Build(), "verify", "--data", _dir);

        Assert.Equal((1, 1), (code, textCode));
        var p = Json(output).GetProperty("problems").EnumerateArray().Single(x => x.GetProperty("entry").ValueKind == JsonValueKind.Number);
        Assert.Equal(_candidate, p.GetProperty("case").GetString());
        Assert.Equal(2, p.GetProperty("entry").GetInt32());
        Assert.Contains("Entry 2 (", p.GetProperty("what").GetString(), StringComparison.Ordinal);
        Assert.Contains($"{_candidate} entry 2: Timeline: Entry 2 (", text, StringComparison.Ordinal);
    }

    [Fact]
    public async Task An_altered_attachment_on_disk_gives_exit_1()
    {
        var path = new AttachmentStore(DatabaseSettings.ForSqlite(_dir)).PathFor(Core.Evidence.Hashing.Sha256Hex(SampleCase.AttachmentBytes));
        await File.WriteAllTextAsync(path, "gps_time,value\n1.0,2.5\n");

        var (code, output, _) = CliRunner.Run(VerifyCommand.Build(), "verify", "--data", _dir, "--json");

        Assert.Equal(1, code);
        var p = Assert.Single(Json(output).GetProperty("problems").EnumerateArray());
        // The name given as "../delays.csv" is kept for display only, without its folder part.
        Assert.Contains("file 'delays.csv'", p.GetProperty("what").GetString(), StringComparison.Ordinal);
        Assert.Contains("missing or altered", p.GetProperty("what").GetString(), StringComparison.Ordinal);
    }

    [Fact]
    public async Task Problems_found_are_recorded_once_a_day_as_a_notification_to_every_coordinator()
    {
        var (added, _, addError) = CliRunner.Run(UsersCommand.Build(), "users", "add", "--email", "lead@example.org", "--role", "coordinator", "--password", "Lead-Coordinator-Passphrase-42", "--data", _dir);
        Assert.True(added == 0, addError);
        var path = new AttachmentStore(DatabaseSettings.ForSqlite(_dir)).PathFor(Core.Evidence.Hashing.Sha256Hex(SampleCase.AttachmentBytes));
        await File.WriteAllTextAsync(path, "gps_time,value\n1.0,2.5\n");

        var (first, _, _) = CliRunner.Run(VerifyCommand.Build(), "verify", "--data", _dir);
        var (again, _, _) = CliRunner.Run(VerifyCommand.Build(), "verify", "--data", _dir);

        Assert.Equal((1, 1), (first, again));
        await using var db = new AppDbContextFactory(DatabaseSettings.ForSqlite(_dir)).CreateDbContext();
        var lead = await db.Users.SingleAsync(u => u.Email == "lead@example.org");
        var notice = Assert.Single(await db.Notifications.Where(n => n.UserId == lead.Id).ToListAsync());
        Assert.Equal(Core.Notifications.NotificationKind.VerifyFailed, notice.Kind);
        Assert.Contains("from eventreview verify", notice.Text, StringComparison.Ordinal);
        Assert.Contains("missing or altered", notice.Text, StringComparison.Ordinal);
    }

    [Fact]
    public void An_unknown_case_exits_2_with_a_one_line_error()
    {
        var (code, _, error) = CliRunner.Run(VerifyCommand.Build(), "verify", "--data", _dir, "--case", "9999");

        Assert.Equal(2, code);
        Assert.Contains("There is no case with id 9999", error, StringComparison.Ordinal);
    }

    [Fact]
    public void A_dossier_verifies_against_the_record_key_folder_and_an_empty_folder_leaves_it_unsigned()
    {
        // --key may name the key folder itself (it once answered with a stack trace): its public list is used.
        var zip = Path.Combine(_dir, "folder-key.zip");
        var (exportCode, _, exportError) = CliRunner.Run(DossierCommand.Build(), "dossier", "export", "--data", _dir, "--case", _caseId.ToString(System.Globalization.CultureInfo.InvariantCulture), "--out", zip);
        Assert.True(exportCode == 0, exportError);

        var (code, output, error) = CliRunner.Run(DossierCommand.Build(), "dossier", "verify", zip, "--key", Path.Combine(_dir, "keys"));
        Assert.True(code == 0, output + error);
        Assert.StartsWith("valid", output.Trim(), StringComparison.Ordinal);

        var empty = Directory.CreateDirectory(Path.Combine(_dir, "no-keys")).FullName;
        var (emptyCode, emptyOutput, emptyError) = CliRunner.Run(DossierCommand.Build(), "dossier", "verify", zip, "--key", empty);
        Assert.Equal(1, emptyCode);
        Assert.Contains("unsigned", emptyOutput + emptyError, StringComparison.Ordinal);
        Assert.DoesNotContain("   at ", emptyOutput + emptyError, StringComparison.Ordinal);
    }

    [Fact]
    public async Task Export_then_verify_is_valid_and_an_altered_byte_in_the_dossier_data_is_named()
    {
        var zip = Path.Combine(_dir, "case.zip");

        var (exportCode, _, exportError) = CliRunner.Run(DossierCommand.Build(), "dossier", "export", "--data", _dir, "--case", _caseId.ToString(System.Globalization.CultureInfo.InvariantCulture), "--out", zip);
        var keys = Path.Combine(_dir, "keys", "record-keys.json");
        var (verifyCode, verifyOutput, _) = CliRunner.Run(DossierCommand.Build(), "dossier", "verify", zip, "--key", keys);

        Assert.True(exportCode == 0, exportError);
        Assert.False(File.Exists(zip + ".partial"));
        Assert.Equal(0, verifyCode);
        Assert.StartsWith("valid (signed by the trusted key ", verifyOutput.Trim(), StringComparison.Ordinal);

        // Change one byte of dossier.json's content (re-compressed so the ZIP itself stays readable).
        using (var archive = ZipFile.Open(zip, ZipArchiveMode.Update))
        {
            var entry = archive.GetEntry("dossier.json")!;
            byte[] bytes;
            using (var s = entry.Open())
            using (var ms = new MemoryStream())
            {
                s.CopyTo(ms);
                bytes = ms.ToArray();
            }

            var at = Array.IndexOf(bytes, (byte)'7');
            Assert.True(at > 0, "dossier.json has a digit 7 to change");
            bytes[at] = (byte)'8';
            entry.Delete();
            using var w = archive.CreateEntry("dossier.json").Open();
            w.Write(bytes);
        }

        var (badCode, badOutput, _) = CliRunner.Run(DossierCommand.Build(), "dossier", "verify", zip, "--json", "--key", keys);

        Assert.Equal(1, badCode);
        var json = Json(badOutput);
        Assert.False(json.GetProperty("valid").GetBoolean());
        Assert.Contains(json.GetProperty("problems").EnumerateArray(), p => p.GetProperty("file").GetString() == "dossier.json");
    }

    [Fact]
    public void Export_of_an_unknown_case_exits_2_and_writes_nothing()
    {
        var zip = Path.Combine(_dir, "none.zip");

        var (code, _, error) = CliRunner.Run(DossierCommand.Build(), "dossier", "export", "--data", _dir, "--case", "9999", "--out", zip);

        Assert.Equal(2, code);
        Assert.Contains("There is no case with id 9999", error, StringComparison.Ordinal);
        Assert.False(File.Exists(zip));
        Assert.False(File.Exists(zip + ".partial"));
    }
}
