using System.CommandLine;
using EventReview.Cli.Commands;

var root = new RootCommand("eventreview: command-line tool for EventReview (administration, scripting and the built-in checks).");
foreach (var command in CommandCatalog.All())
{
    root.Subcommands.Add(command);
}

return await root.Parse(args).InvokeAsync();

/// <summary>Entry point marker for tests.</summary>
public partial class Program;
