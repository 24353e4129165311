using EventReview.Core.Time;
using EventReview.Web.Services.Checks;

namespace EventReview.Web.Tests.Services.Checks;

/// <summary>
/// The run forms' text fields are read by the parameter records (<see cref="OverlapCheckParameters.TryParseCentre"/>,
/// <see cref="OverlapCheckParameters.TryParseNotches"/>, <see cref="StrainPick.TryParse"/>), not by the pages: GPS times
/// through <see cref="GpsTime.TryParse"/>, every refusal naming the field as the form labels it.
/// </summary>
public sealed class RunFormParsingTests
{
    [Fact]
    public void A_centre_keeps_every_nanosecond_and_blank_means_the_case_time()
    {
        Assert.True(OverlapCheckParameters.TryParseCentre(" 1400000000.123456789 ", out var centre, out var problem));
        Assert.Null(problem);
        Assert.Equal(1_400_000_000.123456789m, centre);

        Assert.True(OverlapCheckParameters.TryParseCentre("  ", out var blank, out _));
        Assert.Null(blank);
    }

    [Theory]
    [InlineData("12:00:00")]
    [InlineData("1400000000,5")]
    [InlineData("NaN")]
    [InlineData("1e30")] // a number, but no GPS time: beyond the range GpsTime holds
    public void A_centre_that_is_not_a_gps_time_is_refused_naming_the_field(string text)
    {
        Assert.False(OverlapCheckParameters.TryParseCentre(text, out var centre, out var problem));
        Assert.Null(centre);
        Assert.StartsWith("Centre (GPS s):", problem, StringComparison.Ordinal);
        Assert.Contains(text.Trim(), problem, StringComparison.Ordinal);
    }

    [Fact]
    public void Notches_are_read_in_hz_with_any_of_the_separators_and_a_bad_part_is_named()
    {
        Assert.True(OverlapCheckParameters.TryParseNotches("35.5, 71;142 ", out var notches, out _));
        Assert.Equal([35.5, 71, 142], notches);

        Assert.False(OverlapCheckParameters.TryParseNotches("35.5, seventy", out _, out var problem));
        Assert.Equal("Notches (Hz): \"seventy\" is not a frequency in Hz.", problem);
    }

    [Fact]
    public void A_text_strain_file_needs_only_its_pick_and_a_missing_pick_names_the_site()
    {
        Assert.True(StrainPick.TryParse("A", "abc123", isHdf5: false, "ignored", "ignored", null, out var pick, out _));
        Assert.Equal(new StrainPick("abc123"), pick);

        Assert.False(StrainPick.TryParse("B", null, isHdf5: false, null, null, null, out _, out var problem));
        Assert.StartsWith("Strain of site B:", problem, StringComparison.Ordinal);
    }

    [Fact]
    public void An_hdf5_strain_file_needs_its_dataset_and_a_start_that_is_a_gps_time()
    {
        Assert.False(StrainPick.TryParse("A", "abc", isHdf5: true, " ", null, null, out _, out var noDataset));
        Assert.StartsWith("HDF5 dataset of A:", noDataset, StringComparison.Ordinal);

        Assert.False(StrainPick.TryParse("B", "abc", isHdf5: true, "/strain", "yesterday", 4096, out _, out var badStart));
        Assert.StartsWith("Start GPS (s) of B:", badStart, StringComparison.Ordinal);

        Assert.True(StrainPick.TryParse("A", "abc", isHdf5: true, " /strain ", "1400000000.000000001", 4096, out var pick, out _));
        Assert.Equal(new StrainPick("abc", "/strain", 1_400_000_000.000000001m, 4096), pick);
    }

    [Fact]
    public void A_partly_given_antenna_observation_is_told_apart_from_none_and_a_whole_one()
    {
        Assert.False(new Core.Timing.TimingCheckParameters().HasPartialObservation);
        Assert.True(new Core.Timing.TimingCheckParameters(PairA: "KP").HasPartialObservation);
        Assert.True(new Core.Timing.TimingCheckParameters(ObservedAmplitudeRatio: 0.8).HasPartialObservation);
        Assert.False(new Core.Timing.TimingCheckParameters(PairA: "KP", PairB: "AB", ObservedSign: -1, ObservedAmplitudeRatio: 0.8).HasPartialObservation);
    }
}
