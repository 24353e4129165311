using System.Diagnostics;
using System.Text;

namespace EventReview.Core.Tests.Repository;

/// <summary>The text files git tracks in the repository this test build came from.</summary>
internal static class TrackedFiles
{
    /// <summary>Extensions of tracked files that are not text (skipped by the scans).</summary>
    private static readonly HashSet<string> Binary = new(StringComparer.OrdinalIgnoreCase) { ".png", ".jpg", ".jpeg", ".gif", ".ico", ".pdf", ".zip", ".h5", ".hdf5", ".woff", ".woff2", ".ttf" };

    /// <summary>The repository root: the nearest folder above the test binaries that holds EventReview.sln.</summary>
    public static string Root { get; } = FindRoot();

    /// <summary>Tracked text files under the given paths (relative to the root, '/' separators), with their text.</summary>
    /// <exception cref="InvalidOperationException">When git is missing or the folder is not a git checkout: the scan cannot run.</exception>
    public static IReadOnlyList<(string Path, string Text)> Read(params string[] paths)
    {
        var psi = new ProcessStartInfo("git") { WorkingDirectory = Root, RedirectStandardOutput = true, RedirectStandardError = true, StandardOutputEncoding = Encoding.UTF8 };
        foreach (var a in new[] { "ls-files", "-z", "--" }.Concat(paths))
        {
            psi.ArgumentList.Add(a);
        }

        using var git = Process.Start(psi) ?? throw new InvalidOperationException("git could not be started: the tracked-file scan needs git and a checkout.");
        var output = git.StandardOutput.ReadToEnd();
        var error = git.StandardError.ReadToEnd();
        git.WaitForExit();
        if (git.ExitCode != 0)
        {
            throw new InvalidOperationException($"git ls-files failed in {Root} (exit {git.ExitCode}): {error.Trim()}");
        }

        var files = output.Split('\0', StringSplitOptions.RemoveEmptyEntries)
            .Where(f => !Binary.Contains(Path.GetExtension(f)))
            .Select(f => (Path: f, Full: Path.Combine(Root, f)))
            .Where(f => File.Exists(f.Full)) // a file deleted in the work tree but not yet committed
            .Select(f => (f.Path, File.ReadAllText(f.Full)))
            .ToList();
        if (files.Count == 0)
        {
            throw new InvalidOperationException($"git ls-files listed no file under {string.Join(", ", paths)} in {Root}.");
        }

        return files;
    }

    private static string FindRoot()
    {
        var dir = new DirectoryInfo(AppContext.BaseDirectory);
        while (dir is not null && !File.Exists(Path.Combine(dir.FullName, "EventReview.sln")))
        {
            dir = dir.Parent;
        }

        return dir?.FullName ?? throw new InvalidOperationException($"No EventReview.sln above {AppContext.BaseDirectory}.");
    }
}
