using EventReview.Core.Checklists;
using Microsoft.Extensions.Options;

namespace EventReview.Web.Services;

/// <summary>The checklist templates, loaded and validated once at start-up.</summary>
public sealed class TemplateCatalog
{
    private readonly IReadOnlyDictionary<string, ChecklistTemplate> _templates;

    public TemplateCatalog(IOptions<EventReviewOptions> options, IHostEnvironment env)
    {
        var candidates = new[]
        {
            options.Value.ChecklistDirectory,
            Path.Combine(AppContext.BaseDirectory, "checklists"),
            Path.Combine(env.ContentRootPath, "checklists"),
            Path.Combine(env.ContentRootPath, "..", "..", "checklists"),
        };
        Directory = candidates.FirstOrDefault(d => d is not null && System.IO.Directory.Exists(d))
            ?? throw new InvalidOperationException("No checklist folder found; set EventReview:ChecklistDirectory.");
        _templates = ChecklistTemplateLoader.LoadFolder(Directory);
    }

    public string Directory { get; }

    public IReadOnlyCollection<ChecklistTemplate> All => _templates.Values.ToList();

    public ChecklistTemplate? Find(string? name) => name is not null && _templates.TryGetValue(name, out var t) ? t : null;
}
