using System.Text.Json;
using EventReview.Cli.Commands;

namespace EventReview.Cli.Tests.Commands;

[Collection("Console")]
public sealed class TokensCommandTests : IDisposable
{
    private readonly string _dir = Path.Combine(Path.GetTempPath(), "er-cli-tokens-" + Guid.NewGuid().ToString("N"));

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

    [Fact]
    public void A_token_gets_the_pipeline_scopes_and_ninety_days_unless_told_otherwise()
    {
        var (exit, output, _) = CliRunner.Run(TokensCommand.Build(), "tokens", "create", "--name", "search A", "--data", _dir, "--json");

        Assert.Equal(0, exit);
        var json = JsonDocument.Parse(output).RootElement;
        Assert.Equal(["cases:open", "evidence:add"], json.GetProperty("scopes").EnumerateArray().Select(s => s.GetString()));
        Assert.StartsWith("ert_", json.GetProperty("token").GetString(), StringComparison.Ordinal);
        Assert.InRange((json.GetProperty("expiresAt").GetDateTimeOffset() - DateTimeOffset.UtcNow).TotalDays, 89.9, 90.1);
    }

    [Fact]
    public void Scopes_and_lifetime_are_chosen_and_listed_with_the_state_but_never_the_secret()
    {
        var (exit, created, _) = CliRunner.Run(TokensCommand.Build(), "tokens", "create", "--name", "reader", "--scope", "cases:read", "--scope", "evidence:add", "--expires-in-days", "7", "--data", _dir, "--json");
        Assert.Equal(0, exit);
        var secret = JsonDocument.Parse(created).RootElement.GetProperty("token").GetString()!;

        var (listExit, listed, _) = CliRunner.Run(TokensCommand.Build(), "tokens", "list", "--data", _dir, "--json");

        Assert.Equal(0, listExit);
        var token = JsonDocument.Parse(listed).RootElement.EnumerateArray().Single(t => t.GetProperty("name").GetString() == "reader");
        Assert.Equal(["cases:read", "evidence:add"], token.GetProperty("scopes").EnumerateArray().Select(s => s.GetString()));
        Assert.Equal("active", token.GetProperty("state").GetString());
        Assert.DoesNotContain(secret, listed, StringComparison.Ordinal);
    }

    [Theory]
    [InlineData("--scope", "cases:sign", "'cases:sign'")]
    [InlineData("--expires-in-days", "400", "1 to 366 days")]
    public void A_bad_scope_or_lifetime_is_refused_with_exit_2(string option, string value, string message)
    {
        var (exit, _, error) = CliRunner.Run(TokensCommand.Build(), "tokens", "create", "--name", "bad", option, value, "--data", _dir);

        Assert.Equal(2, exit);
        Assert.Contains(message, error, StringComparison.Ordinal);
    }
}
