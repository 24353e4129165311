using EventReview.Core.Cases;
using EventReview.Core.Checklists;
using EventReview.Core.Time;

namespace EventReview.Core.Tests.Builders;

/// <summary>
/// Builds a <see cref="ReviewCase"/> with sensible defaults: candidate "TC-0001" at GPS 1400000000.25, arrivals at
/// sites "KX" and "MV" within a few milliseconds, the <see cref="TemplateBuilder.Default"/> checklist, opened by
/// <see cref="People.Coordinator"/> at <see cref="Clock.T0"/>.
/// </summary>
public sealed class CaseBuilder
{
    private readonly List<(string Code, double OffsetSeconds, double Snr)> _arrivals = [("KX", 0.0021, 9.5), ("MV", -0.0043, 7.25)];
    private readonly TemplateBuilder _items = new();
    private string _candidateId = "TC-0001";
    private GpsTime _gps = GpsTime.FromSeconds(1_400_000_000.25m);
    private string _search = "test-search";
    private string _summary = "An invented candidate for tests.";
    private ChecklistTemplate? _template;
    private Actor _coordinator = People.Coordinator;
    private DateTimeOffset _now = Clock.T0;

    public CaseBuilder WithCandidateId(string candidateId)
    {
        _candidateId = candidateId;
        return this;
    }

    public CaseBuilder AtGps(GpsTime gps)
    {
        _gps = gps;
        return this;
    }

    public CaseBuilder WithSearch(string search, string summary)
    {
        _search = search;
        _summary = summary;
        return this;
    }

    /// <summary>Replaces the arrivals with one per code (offsets of 1 ms per site, SNR 8).</summary>
    public CaseBuilder WithSites(params string[] codes)
    {
        _arrivals.Clear();
        for (var i = 0; i < codes.Length; i++)
        {
            _arrivals.Add((codes[i], 0.001 * i, 8.0));
        }

        return this;
    }

    public CaseBuilder WithArrival(string code, double offsetSeconds, double snr)
    {
        _arrivals.Add((code, offsetSeconds, snr));
        return this;
    }

    public CaseBuilder WithoutArrivals()
    {
        _arrivals.Clear();
        return this;
    }

    public CaseBuilder WithTemplate(ChecklistTemplate template)
    {
        _template = template;
        return this;
    }

    /// <summary>Adds an item to a checklist built here (instead of the default template).</summary>
    public CaseBuilder WithItem(string key, int signoffs = 1, bool ownerMaySign = false, int? dueDays = null)
    {
        _items.Item(key, signoffs, ownerMaySign, dueDays);
        return this;
    }

    public CaseBuilder OpenedBy(Actor coordinator)
    {
        _coordinator = coordinator;
        return this;
    }

    public CaseBuilder OpenedAt(DateTimeOffset now)
    {
        _now = now;
        return this;
    }

    public ReviewCase Build()
    {
        var template = _template ?? (_items.HasItems ? _items.Build() : TemplateBuilder.Default());
        var arrivals = _arrivals.Select(a => new CaseArrival(a.Code, _gps.AddSeconds(a.OffsetSeconds), a.Snr));
        return ReviewCase.Open(_candidateId, _gps, _search, _summary, arrivals, template, _coordinator, _now);
    }
}
