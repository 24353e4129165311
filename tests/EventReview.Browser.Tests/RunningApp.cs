using System.Diagnostics;
using System.Net;
using System.Net.Sockets;
using System.Text;

namespace EventReview.Browser.Tests;

/// <summary>
/// The real app started from its build output (src/EventReview.Web/bin/{Configuration}/net10.0/EventReview.Web.dll)
/// as a child process in Development (demo seeded) on a free local port, with its own temp data folder.
/// Killed and cleaned up on dispose.
/// </summary>
public class RunningApp : IAsyncLifetime
{
    private readonly StringBuilder _log = new();
    private Process? _process;

    public string DataDirectory { get; } = Path.Combine(Path.GetTempPath(), $"er-browser-{Guid.NewGuid():N}");

    public string BaseUrl { get; private set; } = string.Empty;

    /// <summary>What the app printed so far (for failure messages).</summary>
    public string Log
    {
        get
        {
            lock (_log)
            {
                return _log.ToString();
            }
        }
    }

    public async Task InitializeAsync()
    {
        var dll = WebAppDll();
        var port = FreePort();
        BaseUrl = $"http://127.0.0.1:{port}";
        await BeforeStartAsync();
        Directory.CreateDirectory(DataDirectory);
        var psi = new ProcessStartInfo("dotnet")
        {
            WorkingDirectory = Path.GetDirectoryName(dll)!,
            RedirectStandardOutput = true,
            RedirectStandardError = true,
            UseShellExecute = false,
        };
        psi.ArgumentList.Add(dll);
        psi.Environment["ASPNETCORE_ENVIRONMENT"] = "Development";
        psi.Environment["ASPNETCORE_URLS"] = BaseUrl;
        psi.Environment["EventReview__DataDirectory"] = DataDirectory;
        psi.Environment["DOTNET_NOLOGO"] = "1";
        foreach (var (key, value) in Settings)
        {
            psi.Environment[key] = value;
        }

        _process = Process.Start(psi) ?? throw new InvalidOperationException("Could not start the web app.");
        _process.OutputDataReceived += (_, e) => Append(e.Data);
        _process.ErrorDataReceived += (_, e) => Append(e.Data);
        _process.BeginOutputReadLine();
        _process.BeginErrorReadLine();

        using var http = new HttpClient { Timeout = TimeSpan.FromSeconds(5) };
        var deadline = DateTime.UtcNow.AddMinutes(3);
        while (DateTime.UtcNow < deadline)
        {
            if (_process.HasExited)
            {
                throw new InvalidOperationException($"The web app exited with code {_process.ExitCode}:\n{Log}");
            }

            try
            {
                using var response = await http.GetAsync($"{BaseUrl}/signin");
                if (response.StatusCode == HttpStatusCode.OK)
                {
                    return;
                }
            }
            catch (HttpRequestException)
            {
            }
            catch (TaskCanceledException)
            {
            }

            await Task.Delay(250);
        }

        throw new TimeoutException($"The web app did not answer /signin within 3 minutes:\n{Log}");
    }

    /// <summary>More environment variables for the app (a subclass fills them in <see cref="BeforeStartAsync"/>).</summary>
    protected Dictionary<string, string> Settings { get; } = new(StringComparer.Ordinal);

    /// <summary>Runs once <see cref="BaseUrl"/> is known and before the app starts (start what the app needs here).</summary>
    protected virtual Task BeforeStartAsync() => Task.CompletedTask;

    /// <summary>Runs after the app has stopped.</summary>
    protected virtual Task AfterStopAsync() => Task.CompletedTask;

    public async Task DisposeAsync()
    {
        if (_process is { HasExited: false })
        {
            _process.Kill(entireProcessTree: true);
            await _process.WaitForExitAsync();
        }

        _process?.Dispose();
        await AfterStopAsync();
        try
        {
            Directory.Delete(DataDirectory, recursive: true);
        }
        catch (IOException)
        {
        }
    }

    /// <summary>The web app's build output, found from the repository root (the folder with EventReview.sln).</summary>
    public static string WebAppDll()
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
        var dll = Path.Combine(dir.FullName, "src", "EventReview.Web", "bin", configuration, "net10.0", "EventReview.Web.dll");
        return File.Exists(dll) ? dll : throw new FileNotFoundException($"Build src/EventReview.Web first ({configuration}); not found: {dll}", dll);
    }

    private void Append(string? line)
    {
        if (line is null)
        {
            return;
        }

        lock (_log)
        {
            _log.AppendLine(line);
        }
    }

    private static int FreePort()
    {
        using var listener = new TcpListener(IPAddress.Loopback, 0);
        listener.Start();
        return ((IPEndPoint)listener.LocalEndpoint).Port;
    }
}
