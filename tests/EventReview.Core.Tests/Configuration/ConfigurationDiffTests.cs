using EventReview.Core.Cases;
using EventReview.Core.Configuration;

namespace EventReview.Core.Tests.Configuration;

public class ConfigurationDiffTests
{
    private static readonly Actor Coordinator = new("u1", "Ada Quill");
    private static readonly DateTimeOffset T = new(2031, 1, 2, 3, 4, 5, TimeSpan.Zero);

    [Fact]
    public void Compare_lists_added_removed_changed_and_counts_unchanged_in_key_order()
    {
        var frozen = new Dictionary<string, string> { ["a"] = "1", ["b"] = "2", ["c"] = "3", ["d"] = "x" };
        var later = new Dictionary<string, string> { ["a"] = "1", ["b"] = "2 ", ["e"] = "5", ["d"] = "x", ["A"] = "0" };

        var diff = ConfigurationDiff.Compare(frozen, later);

        Assert.Equal([new ConfigurationEntry("A", "0"), new ConfigurationEntry("e", "5")], diff.Added);
        Assert.Equal([new ConfigurationEntry("c", "3")], diff.Removed);
        Assert.Equal([new ConfigurationChange("b", "2", "2 ")], diff.Changed);
        Assert.Equal(2, diff.Unchanged);
        Assert.True(diff.HasDrift);
    }

    [Fact]
    public void Identical_items_have_no_drift()
    {
        var items = new Dictionary<string, string> { ["a"] = "1" };

        var diff = ConfigurationDiff.Compare(items, new Dictionary<string, string>(items));

        Assert.False(diff.HasDrift);
        Assert.Equal(1, diff.Unchanged);
    }

    [Fact]
    public void A_change_captured_during_the_freeze_period_is_a_concern_and_after_it_is_drift()
    {
        var frozen = ConfigurationSnapshot.Capture("KX", "f", new Dictionary<string, string> { ["fw"] = "1" }, Coordinator, T);
        frozen.Freeze(1, T, T.AddDays(3), "review", Coordinator, T);
        var during = ConfigurationSnapshot.Capture("KX", "d", new Dictionary<string, string> { ["fw"] = "2" }, Coordinator, T.AddDays(3));
        // Capture times are kept to the millisecond (as every recorded time): one millisecond after the end is after it.
        var after = ConfigurationSnapshot.Capture("KX", "a", new Dictionary<string, string> { ["fw"] = "2" }, Coordinator, T.AddDays(3).AddMilliseconds(1));
        var same = ConfigurationSnapshot.Capture("KX", "s", new Dictionary<string, string> { ["fw"] = "1" }, Coordinator, T.AddDays(1));

        var r1 = DriftCheck.Run(frozen, during);
        var r2 = DriftCheck.Run(frozen, after);
        var r3 = DriftCheck.Run(frozen, same);

        Assert.True(r1.CapturedDuringFreeze);
        Assert.True(r1.IsConcern);
        Assert.Equal(DriftCheck.Concern, r1.Verdict);
        Assert.Equal(DriftCheck.Drift, r2.Verdict);
        Assert.False(r2.IsConcern);
        Assert.Equal(DriftCheck.NoDrift, r3.Verdict);
        Assert.True(r3.CapturedDuringFreeze);
    }

    [Fact]
    public void Drift_check_needs_a_frozen_snapshot_of_the_same_site()
    {
        var a = ConfigurationSnapshot.Capture("KX", "f", new Dictionary<string, string>(), Coordinator, T);
        var b = ConfigurationSnapshot.Capture("M2", "f", new Dictionary<string, string>(), Coordinator, T);
        Assert.Throws<ArgumentException>(() => DriftCheck.Run(a, a));
        a.Freeze(1, T, T.AddDays(1), "r", Coordinator, T);
        Assert.Throws<ArgumentException>(() => DriftCheck.Run(a, b));
    }
}
