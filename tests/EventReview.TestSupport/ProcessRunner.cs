using System.Diagnostics;

namespace EventReview.TestSupport;

/// <summary>Runs a command to completion and throws with its output when it fails.</summary>
public static class ProcessRunner
{
    /// <summary>Runs <paramref name="fileName"/> with <paramref name="args"/> and returns its output.</summary>
    /// <exception cref="InvalidOperationException">When it exits with a code other than 0 (the message holds its output).</exception>
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

        var (exitCode, stdout, stderr) = await RunToExitAsync(psi, timeout);
        var output = stdout + stderr;
        if (exitCode != 0)
        {
            throw new InvalidOperationException($"{fileName} {string.Join(' ', psi.ArgumentList)} failed with exit code {exitCode}:\n{output}");
        }

        return output;
    }

    /// <summary>Starts <paramref name="psi"/> (output redirected), waits for it and returns its exit code and output; kills it after <paramref name="timeout"/>.</summary>
    /// <exception cref="TimeoutException">When it did not finish in time (it is killed with its children).</exception>
    public static async Task<(int ExitCode, string Stdout, string Stderr)> RunToExitAsync(ProcessStartInfo psi, TimeSpan timeout)
    {
        psi.RedirectStandardOutput = true;
        psi.RedirectStandardError = true;
        psi.UseShellExecute = false;
        using var p = Process.Start(psi) ?? throw new InvalidOperationException($"Could not start {psi.FileName}.");
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
            throw new TimeoutException($"{psi.FileName} {string.Join(' ', psi.ArgumentList)} did not finish within {timeout.TotalSeconds:F0} s.");
        }

        return (p.ExitCode, await stdout, await stderr);
    }
}
