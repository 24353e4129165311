namespace EventReview.Core.Injections;

/// <summary>An injection whose span, widened by the margin, contains a site's arrival time of the candidate.</summary>
/// <param name="Site">Site code.</param>
/// <param name="StartGps">Injection start, GPS seconds.</param>
/// <param name="EndGps">Injection end, GPS seconds.</param>
/// <param name="Kind">Injection kind.</param>
/// <param name="WaveformRef">Waveform reference.</param>
/// <param name="Status">"scheduled", "performed" or "aborted".</param>
/// <param name="OffsetSeconds">Site arrival time minus the nearest point of the injection span (0 when inside it; positive after the end).</param>
/// <param name="Concern">True when this overlap needs a person's look (performed or scheduled); false for an aborted injection, which is only listed.</param>
public sealed record InjectionOverlapHit(string Site, double StartGps, double EndGps, string Kind, string WaveformRef, string Status, double OffsetSeconds, bool Concern = true);
