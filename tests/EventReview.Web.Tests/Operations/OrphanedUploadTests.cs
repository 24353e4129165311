using EventReview.Web.Tests.Fixtures;

namespace EventReview.Web.Tests.Operations;

/// <summary>Temporary files of uploads that a killed process never finished are removed when the app starts.</summary>
public sealed class OrphanedUploadTests(OrphanedUploadTests.WithOrphans app) : IClassFixture<OrphanedUploadTests.WithOrphans>
{
    [Fact]
    public async Task Unfinished_upload_files_left_before_the_start_are_gone_and_stored_files_stay()
    {
        var client = await app.As(Who.Reviewer);
        var caseId = await client.CaseIdAsync("ER-C-0142");

        Assert.False(File.Exists(app.Orphan), "the orphaned .incoming file is still there");
        Assert.True(File.Exists(app.Kept), "a file that is not an unfinished upload was removed");
        using var response = await client.AttachAsync(caseId, "timing.arrival", "after the start"u8.ToArray());
        Assert.Equal(System.Net.HttpStatusCode.Created, response.StatusCode);
        Assert.Empty(Directory.EnumerateFiles(app.AttachmentDirectory, ".incoming-*"));
    }

    /// <summary>The app started over a data folder where a killed upload left its temporary file.</summary>
    public sealed class WithOrphans : EventReviewFactory
    {
        public WithOrphans()
        {
            Directory.CreateDirectory(AttachmentDirectory);
            Orphan = Path.Combine(AttachmentDirectory, ".incoming-" + Guid.NewGuid().ToString("N"));
            File.WriteAllBytes(Orphan, new byte[4096]);
            Kept = Path.Combine(AttachmentDirectory, "README-not-an-upload.txt");
            File.WriteAllText(Kept, "left alone");
        }

        public string Orphan { get; }

        public string Kept { get; }
    }
}
