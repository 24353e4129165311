namespace EventReview.Web.Services;

/// <summary>Someone else changed the same thing first; nothing of this request was applied.</summary>
public sealed class ConflictException(string message) : Exception(message);
