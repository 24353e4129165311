namespace EventReview.Web.Api;

/// <summary>A request whose shape is wrong (a multipart body that cannot be read, a query value that is not a number): answered 400 naming <see cref="Field"/>.</summary>
public sealed class MalformedRequestException(string field, string message, Exception? inner = null) : Exception(message, inner)
{
    /// <summary>The part of the request that could not be read.</summary>
    public string Field { get; } = field;
}
