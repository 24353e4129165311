using EventReview.Cli.Commands;

namespace EventReview.Cli.Tests.Commands;

[Collection("Console")]
public sealed class KeysCommandTests : IDisposable
{
    private readonly string _dir = Path.Combine(Path.GetTempPath(), "er-cli-keys-" + Guid.NewGuid().ToString("N"));

    public void Dispose()
    {
        if (Directory.Exists(_dir))
        {
            Directory.Delete(_dir, recursive: true);
        }
    }

    [Fact]
    public void Show_rotate_and_export_keep_every_key_listed_with_its_validity()
    {
        using (CliRecords.For(_dir))
        {
        }

        var (none, _, noneErr) = CliRunner.Run(KeysCommand.Build(), "keys", "rotate", "--keys", Path.Combine(_dir, "elsewhere"));
        Assert.Equal(2, none);
        Assert.Contains("no record key", noneErr, StringComparison.Ordinal);

        var (rotated, rotateOut, _) = CliRunner.Run(KeysCommand.Build(), "keys", "rotate", "--data", _dir);
        Assert.Equal(0, rotated);
        Assert.StartsWith("new record key ", rotateOut, StringComparison.Ordinal);

        var (shown, showOut, _) = CliRunner.Run(KeysCommand.Build(), "keys", "show", "--data", _dir);
        Assert.Equal(0, shown);
        var lines = showOut.Trim().Split('\n');
        Assert.Equal(2, lines.Length);
        Assert.Contains("retired", lines[0], StringComparison.Ordinal);
        Assert.Contains("current", lines[1], StringComparison.Ordinal);

        var file = Path.Combine(_dir, "public.json");
        Assert.Equal(0, CliRunner.Run(KeysCommand.Build(), "keys", "export", "--data", _dir, "--out", file).Exit);
        Assert.Equal(2, Data.Records.PublicKeyFile.Read(file).Count);
        Assert.DoesNotContain("PRIVATE", File.ReadAllText(file), StringComparison.Ordinal);
    }
}
