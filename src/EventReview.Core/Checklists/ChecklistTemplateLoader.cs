using System.Text.RegularExpressions;
using YamlDotNet.Core;
using YamlDotNet.Serialization;
using YamlDotNet.Serialization.NamingConventions;

namespace EventReview.Core.Checklists;

/// <summary>Loads and validates checklist templates from YAML (camelCase keys; unknown keys are errors).</summary>
public static partial class ChecklistTemplateLoader
{
    private static readonly IDeserializer Deserializer = new DeserializerBuilder()
        .WithNamingConvention(CamelCaseNamingConvention.Instance)
        .Build();

    /// <summary>Parses a template; <paramref name="name"/> is the template name (file name without extension).</summary>
    /// <exception cref="TemplateException">When the YAML is malformed or the template breaks a rule (message names it).</exception>
    public static ChecklistTemplate Parse(string yaml, string name)
    {
        ChecklistTemplate? template;
        try
        {
            template = Deserializer.Deserialize<ChecklistTemplate>(yaml);
        }
        catch (YamlException ex)
        {
            throw new TemplateException($"{name}: YAML error at line {ex.Start.Line}, column {ex.Start.Column}: {ex.InnerException?.Message ?? ex.Message}");
        }

        if (template is null)
        {
            throw new TemplateException($"{name}: the file is empty.");
        }

        template.Name = name;
        Validate(template);
        return template;
    }

    /// <summary>Loads one template file.</summary>
    public static ChecklistTemplate LoadFile(string path) =>
        Parse(File.ReadAllText(path), Path.GetFileNameWithoutExtension(path));

    /// <summary>Loads every <c>*.yaml</c> template of a folder, keyed by name.</summary>
    public static IReadOnlyDictionary<string, ChecklistTemplate> LoadFolder(string folder) =>
        Directory.EnumerateFiles(folder, "*.yaml")
            .OrderBy(p => p, StringComparer.Ordinal)
            .Select(LoadFile)
            .ToDictionary(t => t.Name, StringComparer.Ordinal);

    /// <summary>Checks the rules every template must follow; throws naming the first broken one.</summary>
    public static void Validate(ChecklistTemplate template)
    {
        var n = template.Name;
        if (string.IsNullOrWhiteSpace(template.Title))
        {
            throw new TemplateException($"{n}: 'title' is missing.");
        }

        if (template.Sections.Count == 0)
        {
            throw new TemplateException($"{n}: there are no sections.");
        }

        var keys = new HashSet<string>(StringComparer.Ordinal);
        var sectionKeys = new HashSet<string>(StringComparer.Ordinal);
        foreach (var section in template.Sections)
        {
            if (!KeyPattern().IsMatch(section.Key ?? string.Empty) || !sectionKeys.Add(section.Key!))
            {
                throw new TemplateException($"{n}: section key '{section.Key}' is missing, malformed or repeated.");
            }

            if (string.IsNullOrWhiteSpace(section.Title) || section.Items.Count == 0)
            {
                throw new TemplateException($"{n}: section '{section.Key}' needs a title and at least one item.");
            }

            foreach (var item in section.Items)
            {
                var where = $"{n}: item '{item.Key}' in section '{section.Key}'";
                if (!KeyPattern().IsMatch(item.Key ?? string.Empty))
                {
                    throw new TemplateException($"{where}: the key must be lower-case letters, digits, '.' or '-'.");
                }

                if (!keys.Add(item.Key!))
                {
                    throw new TemplateException($"{where}: the key is used twice.");
                }

                if (string.IsNullOrWhiteSpace(item.Title) || string.IsNullOrWhiteSpace(item.Guidance))
                {
                    throw new TemplateException($"{where}: needs a title and guidance.");
                }

                if (item.Check is not null && !CheckKind.IsKnown(item.Check))
                {
                    throw new TemplateException($"{where}: unknown check '{item.Check}' (known: {string.Join(", ", CheckKind.All)}).");
                }

                if (item.Signoffs is < 1 or > 5)
                {
                    throw new TemplateException($"{where}: signoffs must be between 1 and 5.");
                }

                if (item.DueDays is < 0 or > 365)
                {
                    throw new TemplateException($"{where}: dueDays must be between 0 and 365.");
                }
            }
        }
    }

    [GeneratedRegex("^[a-z0-9][a-z0-9.-]{0,63}$")]
    private static partial Regex KeyPattern();
}
