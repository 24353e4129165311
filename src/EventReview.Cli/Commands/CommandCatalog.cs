using System.CommandLine;

namespace EventReview.Cli.Commands;

/// <summary>Every top-level verb of the CLI. Add one line here per new verb (one file per verb in this folder).</summary>
public static class CommandCatalog
{
    public static IEnumerable<Command> All()
    {
        yield return BackgroundCommand.Build();
    }
}
