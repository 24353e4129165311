namespace EventReview.Web.Services;

/// <summary>Body of <c>POST /api/cases</c> (camelCase JSON). GPS times are decimal seconds; every digit is kept to 1 ns.</summary>
public sealed record OpenCaseRequest(
    string? CandidateId,
    decimal? GpsTime,
    string? Search,
    string? Summary,
    IReadOnlyList<ArrivalRequest>? Arrivals,
    string? Checklist);

/// <summary>One site's arrival in <see cref="OpenCaseRequest"/>.</summary>
public sealed record ArrivalRequest(string? Site, decimal? GpsTime, double? Snr);

/// <summary>Body of <c>POST .../notes</c>.</summary>
public sealed record NoteRequest(string? Text);
