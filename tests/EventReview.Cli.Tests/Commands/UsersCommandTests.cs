using EventReview.Cli.Commands;

namespace EventReview.Cli.Tests.Commands;

[Collection("Console")]
public sealed class UsersCommandTests : IDisposable
{
    private readonly string _dir = Path.Combine(Path.GetTempPath(), "er-cli-users-" + Guid.NewGuid().ToString("N"));

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

    [Theory]
    [InlineData("Password1234", "very common")] // common practice: on the bundled list
    [InlineData("Abc123", "at least 12 characters")]
    [InlineData("lee.park@demo.invalid", "must not be the email address")]
    public void The_command_line_enforces_the_same_password_rules_as_the_app(string password, string reason)
    {
        var (exit, _, error) = CliRunner.Run(UsersCommand.Build(), "users", "add", "--email", "lee.park@demo.invalid", "--role", "reviewer", "--password", password, "--data", _dir);

        Assert.Equal(2, exit);
        Assert.Contains(reason, error, StringComparison.Ordinal);
    }

    [Fact]
    public void An_unusual_long_password_is_accepted()
    {
        var (exit, _, error) = CliRunner.Run(UsersCommand.Build(), "users", "add", "--email", "lee.park@demo.invalid", "--role", "reviewer", "--password", "Granite-Orbit-42", "--data", _dir);

        Assert.True(exit == 0, error);
    }
}
