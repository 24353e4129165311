using System.Text;
using EventReview.Core.Cases;
using EventReview.Core.Checklists;
using EventReview.Core.Configuration;
using EventReview.Core.Evidence;
using EventReview.Core.Network;
using EventReview.Core.Time;

namespace EventReview.TestSupport;

/// <summary>
/// A small case built through the domain methods: three items, a note, an attachment, a link, a computation with
/// two SVG pictures, signed items, one stale sign-off, a frozen configuration and a later snapshot that drifted.
/// </summary>
public sealed class SampleCase
{
    public static readonly DateTimeOffset T0 = new(2031, 3, 14, 9, 26, 53, TimeSpan.Zero);

    public static readonly Actor Coordinator = new("u-coord", "Ada Quill");

    public static readonly Actor Analyst = new("u-anal", "Bram Oster <b>");

    public static readonly Actor Reviewer = new("u-rev", "Cleo Vance");

    public static readonly Actor Second = new("u-sec", "Dario Penn");

    public static readonly byte[] AttachmentBytes = Encoding.UTF8.GetBytes("gps_time,value\n1.0,2.0\n");

    public ReviewCase Case { get; private init; } = null!;

    public IReadOnlyList<Site> Sites { get; private init; } = [];

    public IReadOnlyList<ConfigurationSnapshot> Snapshots { get; private init; } = [];

    public string AttachmentSha256 => Hashing.Sha256Hex(AttachmentBytes);

    /// <summary>Where the attachment goes in the ZIP (schema 3): hash prefix and the safe name.</summary>
    public string AttachmentPath => "attachments/" + AttachmentSha256[..16] + "-delays.csv";

    public static ChecklistTemplate Template() => new()
    {
        Name = "mini-review",
        Title = "Mini review",
        Version = 2,
        Sections =
        [
            new TemplateSection
            {
                Key = "timing",
                Title = "Timing",
                Items =
                [
                    new TemplateItem { Key = "timing.delay", Title = "Arrival delays", Guidance = "Check the **delays** against light travel time.", Check = CheckKind.Timing },
                    new TemplateItem { Key = "timing.notes", Title = "Notes", Guidance = "Anything <script>odd</script>?" },
                ],
            },
            new TemplateSection
            {
                Key = "config",
                Title = "Configuration",
                Items = [new TemplateItem { Key = "config.frozen", Title = "Frozen configuration", Guidance = "Freeze and compare.", Check = CheckKind.Configuration, Signoffs = 2 }],
            },
        ],
    };

    /// <summary>Builds the case; <paramref name="freezeInTimeline"/> false leaves the freeze out of the timeline (for tests that store the case without its configuration records).</summary>
    public static SampleCase Build(bool freezeInTimeline = true)
    {
        var t = T0;
        var c = ReviewCase.Open("ER-C-0314", GpsTime.FromSeconds(1_615_248_000.25m), "burst-search", "A short loud candidate.",
            [new CaseArrival("KX", GpsTime.FromSeconds(1_615_248_000.25m), 9.5), new CaseArrival("MV", GpsTime.FromSeconds(1_615_248_000.2546m), 7.25)],
            Template(), Coordinator, t);

        t = t.AddMinutes(5);
        c.AddEvidence("timing.delay", EvidenceItem.Note("Delay is **4.6 ms**, within the 13.0 ms light time.", Analyst, t), Analyst, t);
        t = t.AddMinutes(1);
        c.AddEvidence("timing.delay", EvidenceItem.Attachment("../delays.csv", "text/csv", AttachmentBytes.Length, Hashing.Sha256Hex(AttachmentBytes), "Delay table", Analyst, t), Analyst, t);
        t = t.AddMinutes(1);
        c.AddEvidence("timing.delay", EvidenceItem.Link("https://logbook.example.org/entry/42", "Log entry", Analyst, t), Analyst, t);
        t = t.AddMinutes(1);
        var svg1 = Core.Plots.PlotSvg.Write(new Core.Plots.PlotFigure(
            "Delay between the sites against the light travel time: the marked delay should sit inside the band",
            new Core.Plots.PlotAxis("delay (ms)", -12, 12), new Core.Plots.PlotAxis("likelihood (dimensionless)", 0, 1.1),
            [
                Core.Plots.PlotBand.Rectangle(-10, 10, 0, 1.1) with { Colour = Core.Plots.PlotPalette.Shade, Label = "allowed by light travel time ± 10 ms" },
                new Core.Plots.PlotLine([5, 6, 7, 8, 9], [0.1, 0.6, 1, 0.6, 0.1]) with { Label = "measured delay ± 1σ" },
            ]));
        var svg2 = "<svg xmlns=\"http://www.w3.org/2000/svg\" width=\"10\" height=\"10\"><rect width=\"4\" height=\"4\"/></svg>";
        c.AddComputation("timing.delay", new ComputationRecord(CheckKind.Timing, "{\"sites\":[\"KX\",\"MV\"]}", new string('a', 64), "eventreview-core 0.1.0",
            "{\"delaySeconds\":0.0046}", "consistent", "delay 4.6 ms within 13.0 ms", svg1 + "\n<!--next-->\n" + svg2, Analyst, t), Analyst, t);
        t = t.AddMinutes(1);
        c.MarkItemReady("timing.delay", Analyst, t);
        t = t.AddMinutes(1);
        c.SignItem("timing.delay", Reviewer, SignOffMeaning.Reviewed, "Delays checked.", c.Item("timing.delay").Fingerprint(), t, GpsTime.FromSeconds(1_615_248_600m));

        // Second item: signed, then more evidence makes the sign-off stale.
        t = t.AddMinutes(1);
        c.AddEvidence("timing.notes", EvidenceItem.Note("Nothing odd.", Analyst, t), Analyst, t);
        c.MarkItemReady("timing.notes", Analyst, t);
        t = t.AddMinutes(1);
        c.SignItem("timing.notes", Reviewer, SignOffMeaning.Approved, "Fine.", c.Item("timing.notes").Fingerprint(), t, GpsTime.FromSeconds(1_615_248_700m));
        t = t.AddMinutes(1);
        c.AddEvidence("timing.notes", EvidenceItem.Note("Correction: one glitch at 2 s.", Analyst, t), Analyst, t);

        var frozen = ConfigurationSnapshot.Capture("KX", "before the run", new Dictionary<string, string>
        {
            ["daq.firmware"] = "4.2.1",
            ["calibration.version"] = "v17",
            ["seal.rack3"] = "S-00917",
        }, Coordinator, T0.AddMinutes(-30));
        frozen.Freeze(c.Id, T0.AddHours(-1), T0.AddDays(7), "Candidate under review.", Coordinator, T0.AddMinutes(2));
        if (freezeInTimeline)
        {
            // As the app does: the freeze is recorded on the configuration item, and the timeline entry records the frozen record.
            t = t.AddMinutes(1);
            c.AddComputation("config.frozen", new ComputationRecord(CheckKind.Configuration, "{\"snapshotId\":0}", frozen.Fingerprint!, "eventreview-core 0.1.0",
                "{\"site\":\"KX\"}", "frozen", "KX configuration frozen", string.Empty, Coordinator, t), Coordinator, t, frozen);
        }

        var later = ConfigurationSnapshot.Capture("KX", "weekly capture", new Dictionary<string, string>
        {
            ["daq.firmware"] = "4.2.2",
            ["calibration.version"] = "v17",
            ["filters.sha256"] = "0f00",
        }, Coordinator, T0.AddDays(2));

        var sites = new List<Site>
        {
            new("MV", "Mesa Vale", 12.0, 18.0, 100.0, 30.0, 120.0, 1e-4),
            new("KX", "Knoll Crest", -9.0, 47.0, 50.0, 10.0, 100.0, 1e-4),
            new("ZZ", "Unused", 0.0, 0.0, 0.0, 0.0, 90.0, 1e-4),
        };
        return new SampleCase { Case = c, Sites = sites, Snapshots = [later, frozen] };
    }
}
