namespace EventReview.Core.Checklists;

/// <summary>A checklist template is malformed; the message names the file and the broken rule.</summary>
public sealed class TemplateException(string message) : Exception(message);
