using System.Globalization;
using EventReview.Core.Time;

namespace EventReview.Core.Significance;

/// <summary>
/// The time-slide background of a two-site candidate and its false-alarm rate, probability and sigma
/// (time slides as in Was et al. 2010, Class. Quantum Grav. 27 015005).
/// </summary>
public static class TimeSlideBackground
{
    /// <summary>
    /// Finds the zero-lag coincidences, slides site B by k x step (k = ±1..±K) on the ring, counts the
    /// background and turns it into FAR, FAP and sigma.
    /// </summary>
    /// <param name="siteA">The fixed site.</param>
    /// <param name="siteB">The sliding site.</param>
    /// <param name="options">Window, step, K and the candidate. When <see cref="TimeSlideOptions.CandidateStatistic"/>
    /// is not finite, the candidate's statistic is taken from the zero-lag coincidence nearest
    /// <see cref="TimeSlideOptions.CandidateTime"/> (or the loudest one).</param>
    /// <param name="progress">Optional progress (slides done, coincidences found).</param>
    /// <param name="cancellationToken">Cancels the search.</param>
    /// <exception cref="ArgumentException">When the candidate cannot be found or the sites never overlap.</exception>
    public static BackgroundResult Run(
        SiteTriggers siteA,
        SiteTriggers siteB,
        TimeSlideOptions options,
        IProgress<BackgroundProgress>? progress = null,
        CancellationToken cancellationToken = default)
    {
        ArgumentNullException.ThrowIfNull(options);
        var pair = new TimeSlidePair(siteA, siteB);
        options.Validate(pair.SpanNs);

        var zeroLag = pair.ZeroLag(options);
        zeroLag.Sort((x, y) => y.Statistic.CompareTo(x.Statistic));
        SlideCoincidence? candidate = null;
        if (zeroLag.Count > 0)
        {
            candidate = options.CandidateTime is { } ct
                ? zeroLag.MinBy(c => Math.Min(Math.Abs(c.TimeANs - ct.Nanoseconds), Math.Abs(c.TimeBNs - ct.Nanoseconds)))
                : zeroLag[0];
        }

        var threshold = options.CandidateStatistic;
        if (!double.IsFinite(threshold))
        {
            threshold = candidate?.Statistic
                ?? throw new ArgumentException("No candidate statistic was given and there is no zero-lag coincidence to take it from.", nameof(options));
        }

        var remove = options.RemoveCandidateTriggers && candidate is not null;
        var acc = new BackgroundAccumulator(
            threshold,
            options.CurveBinWidth,
            options.LoudestCount,
            remove ? candidate!.Value.IndexA : -1,
            remove ? candidate!.Value.IndexB : -1,
            options.JointStatistic);
        if (options.Algorithm == TimeSlideAlgorithm.Naive)
        {
            NaiveTimeSlides.Find(pair, options, acc, progress, cancellationToken);
        }
        else
        {
            FastTimeSlides.Find(pair, options, acc, progress, cancellationToken);
        }

        // summed in 128 bits: 10,000 slides of 30 days is 2.6e19 ns, past the range of a long
        Int128 backgroundNs = 0;
        for (var k = 1; k <= options.Slides; k++)
        {
            backgroundNs += (Int128)pair.OverlapNanoseconds(k * options.StepNs) + pair.OverlapNanoseconds(-k * options.StepNs);
        }

        var backgroundSeconds = (double)backgroundNs / GpsTime.NanosecondsPerSecond;
        var zeroLagSeconds = Seconds(pair.ZeroLagOverlapNanoseconds());
        var observing = options.ObservingTimeSeconds ?? zeroLagSeconds;
        var figures = SignificanceFigures.Compute(acc.Count, acc.Louder, backgroundSeconds, observing);
        var without = remove
            ? SignificanceFigures.Compute(acc.Count - acc.CountWithCandidateTriggers, acc.Louder - acc.LouderWithCandidateTriggers, backgroundSeconds, observing)
            : null;
        var loudest = acc.Loudest();

        return new BackgroundResult
        {
            SiteA = siteA.Code,
            SiteB = siteB.Code,
            Algorithm = options.Algorithm == TimeSlideAlgorithm.Naive ? "naive" : "fast",
            Slides = 2 * options.Slides,
            MaxSlide = options.Slides,
            WindowSeconds = Seconds(options.WindowNs),
            StepSeconds = Seconds(options.StepNs),
            RingStartNs = pair.OriginNs,
            SpanSeconds = Seconds(pair.SpanNs),
            BackgroundSeconds = backgroundSeconds,
            ZeroLagCoincidentSeconds = zeroLagSeconds,
            ObservingTimeSeconds = observing,
            CandidateStatistic = threshold,
            BackgroundCoincidences = figures.BackgroundCoincidences,
            Louder = figures.Louder,
            FarHz = figures.FarHz,
            FarIsBound = figures.FarIsBound,
            FarBoundConfidence = figures.BoundConfidence,
            Fap = figures.Fap,
            Sigma = figures.Sigma,
            SlidesWithLouder = acc.SlidesWithLouder,
            SlidePValue = (acc.SlidesWithLouder + 1.0) / ((2.0 * options.Slides) + 1),
            LouderThanJoint = double.IsPositiveInfinity(options.JointStatistic) ? 0 : acc.LouderThanExtra,
            WithoutCandidateTriggers = without,
            Candidate = candidate is { } c ? Show(pair, c) : null,
            Curve = BackgroundCurve.Build(acc, [.. loudest.Select(l => l.Statistic)], options.LoudestCount, backgroundSeconds),
            Loudest = [.. loudest.Select(l => Show(pair, pair.Coincidence(l.Slide, l.IndexA, l.IndexB, l.Statistic)))],
            ZeroLagCoincidences = zeroLag.Count,
            ZeroLag = [.. zeroLag.Take(options.LoudestCount).Select(z => Show(pair, z))],
            DroppedTriggersA = siteA.DroppedOutsideSegments,
            DroppedTriggersB = siteB.DroppedOutsideSegments,
            Assumptions = Assumptions(pair, options, observing, remove, candidate is not null),
        };
    }

    private static BackgroundCoincidence Show(TimeSlidePair pair, SlideCoincidence c) =>
        new(c.Slide, c.TimeANs, c.TimeBNs, pair.SiteA.Triggers[c.IndexA].Snr, pair.SiteB.Triggers[c.IndexB].Snr, c.Statistic);

    private static double Seconds(long ns) => ns / (double)GpsTime.NanosecondsPerSecond;

    private static List<string> Assumptions(TimeSlidePair pair, TimeSlideOptions o, double observing, bool removed, bool haveCandidate)
    {
        var inv = CultureInfo.InvariantCulture;
        var list = new List<string>
        {
            string.Create(inv, $"Coincidence: |t_{pair.SiteA.Code} - t_{pair.SiteB.Code}| <= {Seconds(o.WindowNs) * 1e3:G9} ms (inclusive, decided in integer ns); ranking statistic = network SNR, sqrt of the sum of squared SNRs."),
            string.Create(inv, $"Time slides: {pair.SiteB.Code} triggers and segments moved by k x {Seconds(o.StepNs):G9} s, k = ±1..±{o.Slides} ({2 * o.Slides} slides), on a ring over [{new GpsTime(pair.OriginNs)}, {new GpsTime(pair.OriginNs + pair.SpanNs)}) GPS ({Seconds(pair.SpanNs):G9} s); shifts wrap modulo the span, coincidences across the seam count, zero lag is never background."),
            "Background time: for each slide, the overlap of the two sites' analysed time after the shift, computed exactly on the ring; summed over slides.",
            "FAR = louder / background time; when no background coincidence is as loud, the 90 % confidence upper bound 2.3026 / background time is reported (Gehrels 1986), the FAP then an upper bound and the sigma a lower bound.",
            string.Create(inv, $"Slide p-value = (slides with a coincidence as loud + 1) / ({2 * o.Slides} slides + 1) (North, Curtis and Sham 2002); each slide is one background realisation of the analysed time (slides share triggers, so they are not fully independent); its floor 1 / {2 * o.Slides + 1} is an upper bound."),
            string.Create(inv, $"FAP = 1 - exp(-FAR x T_obs) with T_obs = {observing:G9} s ({(o.ObservingTimeSeconds is null ? "the zero-lag coincident analysed time" : "given")}); sigma = one-sided Gaussian Q^-1(FAP), 0 when FAP >= 0.5."),
            string.Create(inv, $"Triggers outside their site's segments dropped: {pair.SiteA.Code} {pair.SiteA.DroppedOutsideSegments}, {pair.SiteB.Code} {pair.SiteB.DroppedOutsideSegments}; segments merged: {pair.SiteA.Code} {pair.SiteA.MergedSegments}, {pair.SiteB.Code} {pair.SiteB.MergedSegments}."),
        };
        if (o.ChirpMassRelativeTolerance is { } tol)
        {
            list.Add(string.Create(inv, $"Chirp-mass cut: |m_A - m_B| <= {tol:G6} x mean, applied when both triggers carry a chirp mass."));
        }

        if (o.RemoveCandidateTriggers)
        {
            list.Add(removed
                ? "Also reported: the figures with every background coincidence that uses one of the candidate's own triggers removed (background time unchanged)."
                : haveCandidate ? string.Empty : "Removal of the candidate's triggers was asked for, but no zero-lag coincidence was found to identify them.");
        }

        list.RemoveAll(string.IsNullOrEmpty);
        return list;
    }
}
