namespace EventReview.Data.Writes;

/// <summary>
/// A unit found, after its work was already part of the batch's transaction, that it must not be stored: the writer fails
/// the whole batch instead of committing it (nothing of the batch is stored; every caller gets the error).
/// </summary>
public sealed class BatchAbortException(string message) : Exception(message);
