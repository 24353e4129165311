using System.CommandLine;

namespace EventReview.Cli.Tests;

/// <summary>Runs one CLI verb in-process with standard output and error captured (tests using it share the "Console" collection).</summary>
internal static class CliRunner
{
    public static (int Exit, string Out, string Err) Run(Command command, params string[] args)
    {
        var root = new RootCommand("test") { command };
        var oldOut = Console.Out;
        var oldErr = Console.Error;
        using var sw = new StringWriter();
        using var ew = new StringWriter();
        Console.SetOut(sw);
        Console.SetError(ew);
        try
        {
            var exit = root.Parse(args).Invoke();
            return (exit, sw.ToString(), ew.ToString());
        }
        finally
        {
            Console.SetOut(oldOut);
            Console.SetError(oldErr);
        }
    }

    public static string TempFile(string content, string extension = ".csv")
    {
        var path = Path.Combine(Path.GetTempPath(), "er-lc-" + Guid.NewGuid().ToString("N") + extension);
        File.WriteAllText(path, content);
        return path;
    }
}
