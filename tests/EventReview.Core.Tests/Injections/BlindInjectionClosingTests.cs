using System.Text;
using EventReview.Core.Cases;
using EventReview.Core.Injections;
using EventReview.Core.Time;
using EventReview.Core.Verdicts;

namespace EventReview.Core.Tests.Injections;

public class BlindInjectionClosingTests
{
    private static readonly GpsTime Case = GpsTime.FromSeconds(2000m);
    private static readonly Dictionary<string, GpsTime> Arrivals = new() { ["KX"] = GpsTime.FromSeconds(2000.004m), ["MV"] = GpsTime.FromSeconds(1999.998m) };

    private static byte[] Record(double startOffset) => Encoding.UTF8.GetBytes(
        $"site,start_gps,end_gps,kind,waveform_ref,status\nKX,{2000 + startOffset},{2001 + startOffset},cbc,blind-2,performed");

    [Fact]
    public void An_unopened_seal_holds_back_only_the_astrophysical_outcome()
    {
        var seals = new[] { BlindInjectionClosing.StateOf("period A", null, Case, Arrivals) };
        var astro = BlindInjectionClosing.Decide(CaseOutcome.Astrophysical, seals);
        Assert.False(astro.Allowed);
        Assert.Equal("sealed-record-unopened", astro.Rule);
        Assert.Equal(Verdict.Sealed, astro.Judgement.Verdict);
        Assert.True(BlindInjectionClosing.Decide(CaseOutcome.Instrumental, seals).Allowed);
        Assert.True(BlindInjectionClosing.Decide(CaseOutcome.Injection, seals).Allowed);
    }

    [Fact]
    public void An_opened_record_with_a_blind_injection_at_the_candidate_holds_back_the_astrophysical_outcome()
    {
        // The old rule only asked whether every seal was opened, so this case could be closed as astrophysical.
        var seals = new[] { BlindInjectionClosing.StateOf("period A", Record(-0.5), Case, Arrivals) };
        Assert.True(seals[0].Opened);
        var d = BlindInjectionClosing.Decide(CaseOutcome.Astrophysical, seals);
        Assert.False(d.Allowed);
        Assert.Equal("blind-injection-overlap", d.Rule);
        Assert.Contains("blind-2", d.Judgement.Reason, StringComparison.Ordinal);
        Assert.True(BlindInjectionClosing.Decide(CaseOutcome.Injection, seals).Allowed);
    }

    [Fact]
    public void Opened_records_far_from_the_candidate_allow_closing_as_astrophysical()
    {
        // Both rules agree here: opened, and the blind injection is a day away.
        var seals = new[] { BlindInjectionClosing.StateOf("period A", Record(-86_400), Case, Arrivals) };
        var d = BlindInjectionClosing.Decide(CaseOutcome.Astrophysical, seals);
        Assert.True(d.Allowed);
        Assert.Equal(Verdict.Clear, d.Judgement.Verdict);
        Assert.True(BlindInjectionClosing.Decide(CaseOutcome.Astrophysical, []).Allowed);
    }
}
