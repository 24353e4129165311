namespace EventReview.Data.Backup;

/// <summary>The files of an attachment store folder that follow its content-addressed layout (<c>ab/abcdef...</c>).</summary>
internal static class AttachmentFiles
{
    /// <summary>
    /// Every stored file as (SHA-256 named by its path, full path), ordered by hash. Upload temp files
    /// (<c>.incoming-*</c> at the top level) and anything else off the layout are left out.
    /// </summary>
    public static IReadOnlyList<(string Sha256, string FullPath)> List(string root)
    {
        if (!Directory.Exists(root))
        {
            return [];
        }

        var found = new List<(string, string)>();
        foreach (var folder in Directory.EnumerateDirectories(root))
        {
            var folderName = Path.GetFileName(folder);
            foreach (var file in Directory.EnumerateFiles(folder))
            {
                var name = Path.GetFileName(file);
                if (BackupFormat.IsStoreName(folderName, name))
                {
                    found.Add((name, file));
                }
            }
        }

        return found.OrderBy(f => f.Item1, StringComparer.Ordinal).ToList();
    }
}
