using EventReview.Core.Cases;
using EventReview.Core.Checklists;
using EventReview.Core.Tests.Builders;

namespace EventReview.Core.Tests.Checklists;

/// <summary>Every file in checklists/ (copied to the test output) loads, validates and opens a case.</summary>
public class ChecklistFilesTests
{
    private static string Folder => Path.Combine(AppContext.BaseDirectory, "checklists");

    public static TheoryData<string> Files()
    {
        var data = new TheoryData<string>();
        foreach (var f in Directory.EnumerateFiles(Folder, "*.yaml").Order(StringComparer.Ordinal))
        {
            data.Add(Path.GetFileName(f));
        }

        return data;
    }

    [Fact]
    public void The_checklist_folder_holds_the_two_shipped_templates()
    {
        var names = Directory.EnumerateFiles(Folder, "*.y*ml").Select(Path.GetFileName).ToList();

        Assert.Contains("candidate-review.yaml", names);
        Assert.Contains("rapid-triage.yaml", names);
        Assert.All(names, n => Assert.EndsWith(".yaml", n, StringComparison.Ordinal));
    }

    [Theory]
    [MemberData(nameof(Files))]
    public void Every_template_file_loads_and_passes_validation(string file)
    {
        var t = ChecklistTemplateLoader.LoadFile(Path.Combine(Folder, file));

        Assert.Equal(Path.GetFileNameWithoutExtension(file), t.Name);
        Assert.False(string.IsNullOrWhiteSpace(t.Title));
        Assert.False(string.IsNullOrWhiteSpace(t.Description));
        Assert.True(t.Version >= 1);
        Assert.All(t.Items(), x => Assert.True(x.Item.Check is null || CheckKind.IsKnown(x.Item.Check), x.Item.Key));
        Assert.Equal(t.Items().Count(), t.Items().Select(x => x.Item.Key).Distinct().Count());
    }

    [Theory]
    [MemberData(nameof(Files))]
    public void Every_template_opens_a_case_with_one_open_item_per_template_item(string file)
    {
        var t = ChecklistTemplateLoader.LoadFile(Path.Combine(Folder, file));

        var c = new CaseBuilder().WithTemplate(t).Build();

        Assert.Equal(t.Items().Select(x => x.Item.Key), c.Items.Select(i => i.Key));
        Assert.All(c.Items, i => Assert.Equal(ItemState.Open, i.State));
        Assert.Null(TimelineChain.FirstProblem(c.Timeline));
    }

    [Fact]
    public void The_candidate_review_has_one_section_per_review_point_and_25_to_40_items()
    {
        var t = ChecklistTemplateLoader.LoadFile(Path.Combine(Folder, "candidate-review.yaml"));

        Assert.Equal(8, t.Sections.Count);
        Assert.InRange(t.Items().Count(), 25, 40);
        Assert.All(t.Sections, s => Assert.NotEmpty(s.Items));
    }

    [Fact]
    public void The_rapid_triage_is_a_short_first_hour_list()
    {
        var t = ChecklistTemplateLoader.LoadFile(Path.Combine(Folder, "rapid-triage.yaml"));

        Assert.InRange(t.Items().Count(), 5, 12);
    }

    [Fact]
    public void Every_built_in_check_kind_is_used_by_some_shipped_template()
    {
        var used = ChecklistTemplateLoader.LoadFolder(Folder).Values.SelectMany(t => t.Items()).Select(x => x.Item.Check).OfType<string>().ToHashSet();

        Assert.All(CheckKind.All, k => Assert.Contains(k, used));
    }

    [Fact]
    public void Loading_the_folder_keys_templates_by_file_name()
    {
        var all = ChecklistTemplateLoader.LoadFolder(Folder);

        Assert.True(all.ContainsKey("candidate-review"));
        Assert.True(all.ContainsKey("rapid-triage"));
        Assert.Equal(Directory.EnumerateFiles(Folder, "*.yaml").Count(), all.Count);
    }
}
