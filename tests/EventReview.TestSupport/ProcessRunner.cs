using System.Diagnostics;

namespace EventReview.Data.Tests.Fixtures;

/// <summary>Runs a command to completion and throws with its output when it fails.</summary>
public static class ProcessRunner
{
    public static async Task<string> RunAsync(string fileName, IEnumerable<string> args, TimeSpan timeout)
    {
        var psi = new ProcessStartInfo(fileName)
        {
            RedirectStandardOutput = true,
            RedirectStandardError = true,
            UseShellExecute = false,
        };
        foreach (var a in args)
        {
            psi.ArgumentList.Add(a);
        }

        using var p = Process.Start(psi) ?? throw new InvalidOperationException($"Could not start {fileName}.");
        var stdout = p.StandardOutput.ReadToEndAsync();
        var stderr = p.StandardError.ReadToEndAsync();
        using var cts = new CancellationTokenSource(timeout);
        try
        {
            await p.WaitForExitAsync(cts.Token);
        }
        catch (OperationCanceledException)
        {
            p.Kill(entireProcessTree: true);
            throw new TimeoutException($"{fileName} {string.Join(' ', psi.ArgumentList)} did not finish within {timeout.TotalSeconds:F0} s.");
        }

        var output = await stdout + await stderr;
        if (p.ExitCode != 0)
        {
            throw new InvalidOperationException($"{fileName} {string.Join(' ', psi.ArgumentList)} failed with exit code {p.ExitCode}:\n{output}");
        }

        return output;
    }
}
