using EventReview.Core.Checklists;

namespace EventReview.Core.Tests.Builders;

/// <summary>Builds small checklist templates in code. Items go into the last section started (default "alpha").</summary>
public sealed class TemplateBuilder
{
    private readonly List<TemplateSection> _sections = [];
    private string _name = "test-review";
    private int _version = 1;

    public TemplateBuilder Named(string name, int version = 1)
    {
        _name = name;
        _version = version;
        return this;
    }

    public TemplateBuilder Section(string key, string? title = null)
    {
        _sections.Add(new TemplateSection { Key = key, Title = title ?? $"Section {key}" });
        return this;
    }

    public TemplateBuilder Item(string key, int signoffs = 1, bool ownerMaySign = false, int? dueDays = null, string? check = null)
    {
        if (_sections.Count == 0)
        {
            Section("alpha");
        }

        _sections[^1].Items.Add(new TemplateItem
        {
            Key = key,
            Title = $"Item {key}",
            Guidance = $"Guidance for **{key}**.",
            Signoffs = signoffs,
            OwnerMaySign = ownerMaySign,
            DueDays = dueDays,
            Check = check,
        });
        return this;
    }

    public bool HasItems => _sections.Any(s => s.Items.Count > 0);

    public ChecklistTemplate Build()
    {
        var t = new ChecklistTemplate { Name = _name, Title = "Test review", Version = _version, Sections = _sections };
        ChecklistTemplateLoader.Validate(t);
        return t;
    }

    /// <summary>
    /// The default test template: section "alpha" with <c>alpha.one</c> (1 sign-off) and <c>alpha.two</c> (2 sign-offs,
    /// due in 3 days); section "beta" with <c>beta.one</c> (owner may sign, timing check).
    /// </summary>
    public static ChecklistTemplate Default() => new TemplateBuilder()
        .Section("alpha").Item("alpha.one").Item("alpha.two", signoffs: 2, dueDays: 3)
        .Section("beta").Item("beta.one", ownerMaySign: true, check: CheckKind.Timing)
        .Build();
}
