using System.Diagnostics;
using System.Net;
using System.Net.Sockets;
using System.Text;

namespace EventReview.Web.Tests.Reliability;

/// <summary>
/// The build outputs of the web app and the CLI (src/EventReview.Web/bin/{Configuration}/net10.0/EventReview.Web.dll,
/// src/EventReview.Cli/bin/{Configuration}/net10.0/eventreview.dll) and a way to run them as child processes.
/// </summary>
public static class ChildProcesses
{
    public static string WebAppDll() => Output("EventReview.Web", "EventReview.Web.dll");

    public static string CliDll() => Output("EventReview.Cli", "eventreview.dll");

    /// <summary>A free TCP port on 127.0.0.1.</summary>
    public static int FreePort()
    {
        using var listener = new TcpListener(IPAddress.Loopback, 0);
        listener.Start();
        return ((IPEndPoint)listener.LocalEndpoint).Port;
    }

    /// <summary>Runs the CLI to completion (bounded by <paramref name="timeout"/>); returns its exit code and output.</summary>
    public static Task<(int Exit, string Out, string Err)> RunCliAsync(TimeSpan timeout, params string[] args) =>
        RunCliAsync(timeout, new Dictionary<string, string>(), args);

    /// <summary>Runs the CLI with extra environment variables (as a service's environment file would give).</summary>
    public static async Task<(int Exit, string Out, string Err)> RunCliAsync(TimeSpan timeout, IReadOnlyDictionary<string, string> environment, params string[] args)
    {
        var psi = new ProcessStartInfo("dotnet")
        {
            RedirectStandardOutput = true,
            RedirectStandardError = true,
            UseShellExecute = false,
        };
        psi.ArgumentList.Add(CliDll());
        foreach (var a in args)
        {
            psi.ArgumentList.Add(a);
        }

        psi.Environment["DOTNET_NOLOGO"] = "1";
        foreach (var (key, value) in environment)
        {
            psi.Environment[key] = value;
        }

        return await ProcessRunner.RunToExitAsync(psi, timeout);
    }

    private static string Output(string project, string dll)
    {
        var dir = new DirectoryInfo(AppContext.BaseDirectory);
        while (dir is not null && !File.Exists(Path.Combine(dir.FullName, "EventReview.sln")))
        {
            dir = dir.Parent;
        }

        if (dir is null)
        {
            throw new InvalidOperationException($"No EventReview.sln above {AppContext.BaseDirectory}.");
        }

        // This test assembly's own configuration folder (bin/<Configuration>/net10.0) names the one to use.
        var configuration = new DirectoryInfo(AppContext.BaseDirectory.TrimEnd(Path.DirectorySeparatorChar)).Parent?.Name ?? "Debug";
        var path = Path.Combine(dir.FullName, "src", project, "bin", configuration, "net10.0", dll);
        return File.Exists(path) ? path : throw new FileNotFoundException($"Build src/{project} first ({configuration}); not found: {path}", path);
    }

    /// <summary>Collects a child's output lines (thread-safe) for failure messages.</summary>
    public sealed class OutputLog
    {
        private readonly StringBuilder _text = new();

        public void Append(string? line)
        {
            if (line is null)
            {
                return;
            }

            lock (_text)
            {
                _text.AppendLine(line);
            }
        }

        public override string ToString()
        {
            lock (_text)
            {
                return _text.ToString();
            }
        }
    }
}
