using System.Diagnostics;
using System.Net;

namespace EventReview.Web.Tests.Reliability;

/// <summary>
/// The real web app from its build output as a child process in Development (demo accounts and cases seeded on an
/// empty folder), on a free port of 127.0.0.1, over a given data folder. Can be killed outright (SIGKILL) and started
/// again on the same folder.
/// </summary>
public sealed class ServerProcess : IAsyncDisposable
{
    private readonly Process _process;

    private ServerProcess(Process process, string baseUrl, ChildProcesses.OutputLog log)
    {
        _process = process;
        BaseUrl = baseUrl;
        Log = log;
    }

    public string BaseUrl { get; }

    public ChildProcesses.OutputLog Log { get; }

    public bool HasExited => _process.HasExited;

    /// <summary>Starts the app and waits (at most 3 minutes) until /signin answers 200.</summary>
    public static Task<ServerProcess> StartAsync(string dataDirectory) => StartAsync(dataDirectory, new Dictionary<string, string>());

    /// <summary>Starts the app with extra environment variables (they override the Development defaults set here).</summary>
    public static async Task<ServerProcess> StartAsync(string dataDirectory, IReadOnlyDictionary<string, string> environment, string? workingDirectory = null, string readyPath = "/signin")
    {
        var baseUrl = $"http://127.0.0.1:{ChildProcesses.FreePort()}";
        var dll = ChildProcesses.WebAppDll();
        var psi = new ProcessStartInfo("dotnet")
        {
            WorkingDirectory = workingDirectory ?? Path.GetDirectoryName(dll)!,
            RedirectStandardOutput = true,
            RedirectStandardError = true,
            UseShellExecute = false,
        };
        psi.ArgumentList.Add(dll);
        psi.Environment["ASPNETCORE_ENVIRONMENT"] = "Development";
        psi.Environment["ASPNETCORE_URLS"] = baseUrl;
        psi.Environment["EventReview__DataDirectory"] = dataDirectory;
        psi.Environment["DOTNET_NOLOGO"] = "1";
        foreach (var (key, value) in environment)
        {
            psi.Environment[key] = value;
        }

        var log = new ChildProcesses.OutputLog();
        var process = Process.Start(psi) ?? throw new InvalidOperationException("Could not start the web app.");
        process.OutputDataReceived += (_, e) => log.Append(e.Data);
        process.ErrorDataReceived += (_, e) => log.Append(e.Data);
        process.BeginOutputReadLine();
        process.BeginErrorReadLine();
        var server = new ServerProcess(process, baseUrl, log);

        using var http = new HttpClient { Timeout = TimeSpan.FromSeconds(10) };
        var deadline = DateTime.UtcNow.AddMinutes(3);
        while (DateTime.UtcNow < deadline)
        {
            if (process.HasExited)
            {
                throw new InvalidOperationException($"The web app exited with code {process.ExitCode}:\n{log}");
            }

            try
            {
                using var response = await http.GetAsync($"{baseUrl}{readyPath}");
                if (response.StatusCode == HttpStatusCode.OK)
                {
                    return server;
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

        await server.DisposeAsync();
        throw new TimeoutException($"The web app did not answer {readyPath} within 3 minutes:\n{log}");
    }

    /// <summary>Kills the process at once (SIGKILL: no shutdown, no flushing) and waits for it to be gone.</summary>
    public async Task KillAsync()
    {
        if (!_process.HasExited)
        {
            _process.Kill(entireProcessTree: true);
        }

        using var cts = new CancellationTokenSource(TimeSpan.FromMinutes(1));
        await _process.WaitForExitAsync(cts.Token);
    }

    public async ValueTask DisposeAsync()
    {
        try
        {
            await KillAsync();
        }
        finally
        {
            _process.Dispose();
        }
    }
}
