using EventReview.Core.Live;

namespace EventReview.Core.Tests.Live;

public sealed class ReconnectDelayTests
{
    [Theory]
    [InlineData(1, 0.5)]
    [InlineData(2, 1)]
    [InlineData(3, 2)]
    [InlineData(7, 30)] // 32 s capped at 30 s
    [InlineData(1_000, 30)]
    public void Doubles_from_half_a_second_up_to_thirty(int failures, double seconds) =>
        Assert.Equal(TimeSpan.FromSeconds(seconds), ReconnectDelay.After(failures));

    [Fact]
    public void Refuses_a_count_below_one() => Assert.Throws<ArgumentOutOfRangeException>(() => ReconnectDelay.After(0));
}
