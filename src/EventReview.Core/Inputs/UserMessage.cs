namespace EventReview.Core.Inputs;

/// <summary>
/// The sentence of an exception that a person should read: the framework appends " (Parameter 'name')" (and, for an
/// out-of-range value, a line "Actual value was ...") to an argument exception's message; the field is named by the
/// message itself, so both are left out. Every page, API answer and CLI line that shows a refusal uses this.
/// </summary>
public static class UserMessage
{
    private const string ParameterSuffix = " (Parameter";

    /// <summary>The message of <paramref name="exception"/> up to the framework's parameter suffix, if any.</summary>
    public static string From(Exception exception)
    {
        ArgumentNullException.ThrowIfNull(exception);
        var message = exception.Message;
        var at = message.IndexOf(ParameterSuffix, StringComparison.Ordinal);
        return at >= 0 ? message[..at] : message;
    }
}
