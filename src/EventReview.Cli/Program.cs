using System.CommandLine;
using EventReview.Cli;
using EventReview.Cli.Commands;

var root = new RootCommand("eventreview: command-line tool for EventReview (administration, scripting and the built-in checks).");
foreach (var command in CommandCatalog.All())
{
    root.Subcommands.Add(OptionRanges.Apply(command));
}

// Input the parser refuses (a value that is not a number, a number outside its stated range, a missing option) is bad
// input: exit 2, like every verb's own refusals (the parser prints what was wrong and the usage).
var parsed = root.Parse(args);
var code = await parsed.InvokeAsync();
return parsed.Errors.Count > 0 ? CliOutput.BadInput : code;

/// <summary>Entry point marker for tests.</summary>
public partial class Program;
