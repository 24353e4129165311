using System.Text.Json;
using Bunit;
using EventReview.Core.Cases;
using EventReview.Core.Evidence;
using EventReview.Core.Verdicts;
using EventReview.Web.Components.Checks;
using EventReview.Web.Components.Pages.Cases;
using EventReview.Web.Services.Checks;
using Microsoft.AspNetCore.Components;
using Microsoft.Extensions.DependencyInjection;
using MudBlazor.Services;

namespace EventReview.Web.Tests.Checks;

/// <summary>Records stored in record format 1 by the previous version still verify and still draw, with their stored words.</summary>
public sealed class FormatOneRecordTests : BunitContext
{
    public FormatOneRecordTests()
    {
        Services.AddMudServices(o => o.SnackbarConfiguration.ShowTransitionDuration = 0);
        // The result views as the app registers them (ComputationView finds a record's view through CheckRunners).
        Services.AddCheckView<ChainRunner, ChainResultView>(Core.Checklists.CheckKind.Chain);
        Services.AddCheckView<BackgroundRunner, BackgroundResultView>(Core.Checklists.CheckKind.Background);
        Services.AddCheckView<EnvironmentRunner, EnvironmentResultView>(Core.Checklists.CheckKind.Environment);
        Services.AddCheckView<InjectionsRunner, InjectionsResultView>(Core.Checklists.CheckKind.Injections);
        Services.AddSingleton<CheckRunners>();
        JSInterop.Mode = JSRuntimeMode.Loose;
    }

    public static TheoryData<string, Type> Kinds => new()
    {
        { "chain", typeof(ChainResultView) },
        { "background", typeof(BackgroundResultView) },
        { "environment", typeof(EnvironmentResultView) },
        { "injections", typeof(InjectionsResultView) },
    };

    [Theory]
    [MemberData(nameof(Kinds))]
    public void A_format_1_record_keeps_its_content_hash_and_stored_word_and_draws_as_stored(string kind, Type view)
    {
        var (record, expectedSha) = Load(kind);

        // verify: the content hash of the stored fields is unchanged (reference computed with Python hashlib)
        Assert.Equal(expectedSha, record.ContentSha256);
        Assert.Equal(1, CheckRecords.FormatOf(record.ResultJson));

        // the stored word is still a verdict word with its tone
        Assert.True(VerdictWords.TryParse(record.Verdict, out var verdict), record.Verdict);
        Assert.Equal(record.Verdict, VerdictWords.Word(verdict));

        // draw: the view says it is a format-1 record and shows no error
        var rendered = Render(b =>
        {
            b.OpenComponent(0, view);
            b.AddAttribute(1, "Record", record);
            b.CloseComponent();
        });
        Assert.Contains("record format 1", rendered.Markup, StringComparison.Ordinal);
        Assert.Contains(record.Verdict, rendered.Markup, StringComparison.Ordinal);
        Assert.DoesNotContain("could not be read", rendered.Markup, StringComparison.Ordinal);

        var whole = Render<ComputationView>(p => p.Add(v => v.Record, record).Add(v => v.Latest, true));
        Assert.Contains(record.Verdict, whole.Find(".verdict").TextContent, StringComparison.Ordinal);
    }

    [Fact]
    public void The_legacy_chain_words_keep_their_tone()
    {
        Assert.Equal(VerdictWords.Word(Verdict.NothingAdded), Load("chain").Record.Verdict); // the legacy chain word, as stored
        Assert.Equal(VerdictTone.Good, VerdictWords.ToneOf(Load("chain").Record.Verdict));
        Assert.Equal(VerdictTone.Bad, VerdictWords.ToneOf(VerdictWords.Word(Verdict.SomethingAdded)));
        Assert.Equal(VerdictTone.Good, VerdictWords.ToneOf(Load("background").Record.Verdict)); // "consistent"
    }

    private static (ComputationRecord Record, string Sha) Load(string kind)
    {
        using var doc = JsonDocument.Parse(File.ReadAllText(Path.Combine(AppContext.BaseDirectory, "Checks", "Legacy", $"format1-{kind}.json")));
        var r = doc.RootElement;
        string S(string name) => r.GetProperty(name).GetString()!;
        var record = new ComputationRecord(S("kind"), S("parametersJson"), S("inputFingerprint"), S("toolVersion"), S("resultJson"), S("verdict"), "stored summary",
            string.Empty, new Actor("u", "Reviewer of an earlier version"), DateTimeOffset.UnixEpoch);
        return (record, S("contentSha256"));
    }
}
