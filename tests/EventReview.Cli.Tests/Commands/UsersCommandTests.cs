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

    [Theory]
    [InlineData("--email", "lee.park\u202E@demo.invalid", "email must hold only visible characters")]
    [InlineData("--name", "Lee \u200BPark", "displayName must hold only visible characters")]
    [InlineData("--name", "Lee Park of the decision board of the department of the institute of the collaboration of the network of the sites of the review", "at most 120 characters")]
    public void Names_and_addresses_shown_in_the_record_refuse_hidden_characters_and_excess_length(string option, string value, string reason)
    {
        string[] args = option == "--email"
            ? ["users", "add", "--email", value, "--role", "reviewer", "--data", _dir]
            : ["users", "add", "--email", "lee.park@demo.invalid", "--name", value, "--role", "reviewer", "--data", _dir];

        var (exit, _, error) = CliRunner.Run(UsersCommand.Build(), args);

        Assert.Equal(2, exit);
        Assert.Contains(reason, error, StringComparison.Ordinal);
    }
}
