using EventReview.Core.Inputs;

namespace EventReview.Core.Tests.Inputs;

public sealed class UserMessageTests
{
    [Fact]
    public void An_argument_exception_loses_the_framework_parameter_suffix()
    {
        var ex = new ArgumentException("snr must be between 0 and 10000.", "snr");
        Assert.EndsWith("(Parameter 'snr')", ex.Message, StringComparison.Ordinal); // the framework's own wording
        Assert.Equal("snr must be between 0 and 10000.", UserMessage.From(ex));
    }

    [Fact]
    public void An_out_of_range_value_loses_the_actual_value_line_too()
    {
        var ex = new ArgumentOutOfRangeException("kSigma", 12.0, "k must be between 0 and 10.");
        Assert.Contains("Actual value was 12", ex.Message, StringComparison.Ordinal);
        Assert.Equal("k must be between 0 and 10.", UserMessage.From(ex));
    }

    [Fact]
    public void Other_messages_are_kept_whole()
    {
        Assert.Equal("line 3, column 'snr': 'x' is not a finite number", UserMessage.From(new FormatException("line 3, column 'snr': 'x' is not a finite number")));
    }
}
