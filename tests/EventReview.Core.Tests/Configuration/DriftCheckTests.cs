using EventReview.Core.Configuration;
using EventReview.Core.Verdicts;

namespace EventReview.Core.Tests.Configuration;

public class DriftCheckTests
{
    private static readonly Dictionary<string, string> Frozen = new() { ["filter.bank"] = "v3", ["model.gain"] = "1.0" };
    private static readonly Dictionary<string, string> Changed = new() { ["filter.bank"] = "v4", ["model.gain"] = "1.0" };
    private static readonly DateTimeOffset From = new(2026, 12, 1, 0, 0, 0, TimeSpan.Zero);
    private static readonly DateTimeOffset Until = From.AddDays(14);

    [Fact]
    public void A_change_inside_the_freeze_is_a_concern_and_outside_it_drift()
    {
        var inside = DriftCheck.Run("AB", Frozen, From, Until, Changed, From.AddDays(2));
        Assert.Equal(Verdict.Concern, inside.Judgement.Verdict);
        Assert.Equal("concern", inside.Verdict);
        Assert.True(inside.IsConcern);
        var outside = DriftCheck.Run("AB", Frozen, From, Until, Changed, Until.AddDays(1));
        Assert.Equal(Verdict.Drift, outside.Judgement.Verdict);
        Assert.Equal(Verdict.NoDrift, DriftCheck.Run("AB", Frozen, From, Until, Frozen, From.AddDays(2)).Judgement.Verdict);
    }

    [Fact]
    public void Without_a_freeze_period_a_change_is_drift_and_says_the_period_is_unknown()
    {
        var r = DriftCheck.Compare("AB", Frozen, Changed);
        Assert.Equal(Verdict.Drift, r.Judgement.Verdict);
        Assert.Null(r.CapturedDuringFreeze);
        Assert.Contains("freeze period not known", r.Summary, StringComparison.Ordinal);
        Assert.Equal("no drift", DriftCheck.Compare("AB", Frozen, Frozen).Verdict);
    }
}
