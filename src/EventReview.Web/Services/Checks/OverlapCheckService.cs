using System.Globalization;
using System.Security.Claims;
using EventReview.Core.Cases;
using EventReview.Core.Checklists;
using EventReview.Core.Evidence;
using EventReview.Core.Geodesy;
using EventReview.Core.Signal;
using EventReview.Core.Signal.Io;
using EventReview.Core.Signal.Overlap;
using EventReview.Core.Signal.Pictures;
using EventReview.Core.Signal.TimeFrequency;
using EventReview.Core.Time;
using EventReview.Web.Auth;

namespace EventReview.Web.Services.Checks;

/// <summary>
/// Runs the waveform overlap check on two strain files attached to a case: shift and sign flip that best line up the
/// whitened waveforms, off-source p-value, and a time-frequency map with chirp fit per site; stores a computation record.
/// Re-running with the same files, parameters and tool version adds nothing.
/// </summary>
public sealed class OverlapCheckService(CaseService cases, NetworkService network, CaseFiles files, CheckJobs jobs, IServiceScopeFactory scopes)
{
    /// <summary>Defaults the run form shows: the two loudest sites and the maximum lag the network allows for them.</summary>
    public sealed record Defaults(string? SiteA, string? SiteB, double? MaxLagSeconds, string Rule);

    /// <summary>The defaults for a case and (optionally) chosen sites.</summary>
    public async Task<Defaults> DefaultsAsync(ReviewCase c, string? siteA, string? siteB, double kSigma = 3, CancellationToken ct = default)
    {
        var loud = c.Arrivals.OrderByDescending(a => a.Snr).Select(a => a.SiteCode).ToList();
        var a = siteA ?? loud.FirstOrDefault();
        var b = siteB ?? loud.FirstOrDefault(s => !string.Equals(s, a, StringComparison.OrdinalIgnoreCase));
        if (a is null || b is null)
        {
            return new Defaults(a, b, null, "pick two sites");
        }

        var (lag, rule) = await NetworkLagAsync(a, b, kSigma, ct);
        return new Defaults(a, b, lag, rule);
    }

    /// <summary>Starts the check as a background job (progress, cancel); the job's outcome message says what was stored.</summary>
    public CheckJob Start(ClaimsPrincipal user, int caseId, string itemKey, OverlapCheckParameters parameters)
    {
        Permissions.Require(user, Policies.Work, "run checks");
        parameters.Validate();
        return jobs.Start(CheckJobs.Key(caseId, itemKey, CheckKind.Overlap), "Overlap check", async (job, ct) =>
        {
            // A fresh scope: the page that started the job may go away before it ends.
            await using var scope = scopes.CreateAsyncScope();
            var service = scope.ServiceProvider.GetRequiredService<OverlapCheckService>();
            var (_, added, summary) = await service.RunAsync(user, caseId, itemKey, parameters, job.Report, ct);
            return added ? "stored: " + summary : "same inputs and parameters as the latest record: nothing new stored";
        });
    }

    /// <summary>Runs the check now; returns the updated case, whether a record was added, and the summary line.</summary>
    /// <exception cref="ArgumentException">When a parameter or pick is unusable.</exception>
    /// <exception cref="FormatException">When a strain file does not parse (message names the file and line); nothing is stored.</exception>
    public async Task<(ReviewCase Case, bool Added, string Summary)> RunAsync(ClaimsPrincipal user, int caseId, string itemKey,
        OverlapCheckParameters parameters, Action<double?, string>? progress = null, CancellationToken ct = default)
    {
        Permissions.Require(user, Policies.Work, "run checks");
        parameters.Validate();
        progress = Forward(progress);
        var c = await cases.GetAsync(user, caseId, ct);
        var item = c.Item(itemKey);
        var caseFiles = CaseFiles.List(c);
        string NameOf(StrainPick p) => caseFiles.FirstOrDefault(f => f.Sha256 == p.Sha256)?.FileName
            ?? throw new ArgumentException($"The file {p.Sha256[..Math.Min(12, p.Sha256.Length)]} is not attached to case {c.CandidateId}.", nameof(parameters));
        var nameA = NameOf(parameters.FileA);
        var nameB = NameOf(parameters.FileB);

        var defaults = await DefaultsAsync(c, parameters.SiteA?.Trim().ToUpperInvariant(), parameters.SiteB?.Trim().ToUpperInvariant(), parameters.KSigma, ct);
        if (defaults.SiteA is null || defaults.SiteB is null)
        {
            throw new ArgumentException($"Case {c.CandidateId} has fewer than two arrivals; give the two site codes.", nameof(parameters));
        }

        double allowed;
        string rule;
        if (parameters.MaxLagMs is { } ms)
        {
            allowed = ms / 1e3;
            rule = string.Create(CultureInfo.InvariantCulture, $"given by hand: ±{ms:0.###} ms");
        }
        else
        {
            allowed = defaults.MaxLagSeconds ?? throw new ArgumentException(defaults.Rule + "; give the maximum lag in ms.", nameof(parameters));
            rule = defaults.Rule;
        }

        var resolved = parameters with
        {
            SiteA = defaults.SiteA,
            SiteB = defaults.SiteB,
            CenterGps = parameters.CenterGps ?? c.GpsNanoseconds / 1_000_000_000m,
            MaxLagMs = allowed * 1e3,
            NotchesHz = parameters.NotchesHz ?? [],
        };
        var parametersJson = CheckRecords.Serialize(resolved);
        var inputFingerprint = CheckRecords.Fingerprint(new
        {
            fileA = new { parameters.FileA.Sha256, name = nameA },
            fileB = new { parameters.FileB.Sha256, name = nameB },
            rule,
        });
        var latest = item.Computations.Where(r => r.Kind == CheckKind.Overlap).OrderByDescending(r => r.RunAt).ThenByDescending(r => r.Id).FirstOrDefault();
        if (latest is not null && latest.InputFingerprint == inputFingerprint && latest.ParametersJson == parametersJson && latest.ToolVersion == CheckRecords.ToolVersion)
        {
            return (c, false, latest.Summary);
        }

        progress?.Invoke(0.02, $"reading {nameA}");
        var a = await ReadAsync(parameters.FileA, nameA, ct);
        progress?.Invoke(0.08, $"reading {nameB}");
        var b = await ReadAsync(parameters.FileB, nameB, ct);
        var center = GpsTime.FromSeconds(resolved.CenterGps!.Value);
        var conditioning = new ConditioningOptions(resolved.BandLowHz, resolved.BandHighHz, PsdSegmentSeconds: resolved.PsdSegmentSeconds, NotchFrequenciesHz: resolved.NotchesHz);
        var options = new OverlapOptions(center, resolved.WindowSeconds, allowed, conditioning, resolved.OffSourceTrials);
        var overlapProgress = new Reporter(v => progress?.Invoke(0.15 + (0.65 * v),
            v < 0.5 ? "whitening and band-passing both sites"
            : resolved.OffSourceTrials == 0 ? "correlating" : string.Create(CultureInfo.InvariantCulture, $"off-source overlap {(int)Math.Round((v - 0.5) * 2 * resolved.OffSourceTrials):N0} of {resolved.OffSourceTrials:N0}")));
        var overlap = await Task.Run(() => OverlapCheck.Run(a, b, options, overlapProgress, ct), ct);

        var maps = new List<(OverlapSiteMap Summary, string? Svg)>();
        foreach (var (site, series, name, i) in new[] { (defaults.SiteA, a, nameA, 0), (defaults.SiteB, b, nameB, 1) })
        {
            ct.ThrowIfCancellationRequested();
            progress?.Invoke(0.82 + (0.08 * i), $"time-frequency map and chirp fit of {site}");
            maps.Add(await Task.Run(() => Map(site, series, name, center), ct));
        }

        var arrivalA = c.Arrivals.FirstOrDefault(x => x.SiteCode == defaults.SiteA);
        var arrivalB = c.Arrivals.FirstOrDefault(x => x.SiteCode == defaults.SiteB);
        double? caseLag = arrivalA is not null && arrivalB is not null ? arrivalA.Arrival.SecondsSince(arrivalB.Arrival) : null;
        double step = 1 / overlap.SampleRateHz;
        bool atEdge = overlap.LagsSeconds.Length > 1 && Math.Abs(Math.Abs(overlap.LagSeconds) - overlap.MaxLagSeconds) < 0.5 * step;
        bool within = Math.Abs(overlap.RefinedLagSeconds) <= allowed + (1e-9) && !atEdge;
        var (verdict, reason) = Judge(overlap, within, atEdge, resolved);
        var signNote = SignNote(overlap, defaults.SiteA, defaults.SiteB);
        var result = new OverlapRecordResult(defaults.SiteA, defaults.SiteB, nameA, nameB, overlap, allowed, rule, caseLag, within, atEdge,
            resolved.OverlapThreshold, resolved.PValueThreshold, signNote, reason, maps.Select(m => m.Summary).ToList(),
        [
            string.Create(CultureInfo.InvariantCulture, $"overlap threshold {resolved.OverlapThreshold:0.##}: our default, not a published value; noise limits the overlap of a matched signal to about rho^2/(rho^2 + N) for N independent samples in the window (about 2 x bandwidth x window), so the off-source p-value carries the significance"),
            string.Create(CultureInfo.InvariantCulture, $"consistent = |overlap| >= {resolved.OverlapThreshold:0.##}, lag inside ±{allowed * 1e3:0.00} ms and not at the edge of the searched lags, and p <= {resolved.PValueThreshold:G3} when off-source overlaps were run; concern when only the p-value fails"),
            "allowed lag: " + rule,
            "time-frequency maps: short-time Fourier transform of whitened strain, 0.125 s Hann segments every 1/128 s, 20-500 Hz, the same at every site, from 2 s before to 0.2 s after the candidate time",
            "the sign says how B must be multiplied to match A; whether the sites' orientations allow it is the antenna-response part of the timing check",
        ]);
        var summary = Summarise(result);
        var pictures = new List<string>
        {
            OverlapPictures.Overlay(overlap, defaults.SiteA, defaults.SiteB),
            OverlapPictures.CorrelationCurve(overlap),
            OverlapPictures.OffSourceHistogram(overlap),
        };
        pictures.AddRange(maps.Where(m => m.Svg is not null).Select(m => m.Svg!));
        progress?.Invoke(0.97, "storing the record");
        var updated = await cases.AddComputationAsync(user, caseId, itemKey,
            now => new ComputationRecord(CheckKind.Overlap, parametersJson, inputFingerprint, CheckRecords.ToolVersion, CheckRecords.Serialize(result),
                verdict, summary, string.Join(CheckRecords.PictureSeparator, pictures), user.ToActor(), now), CancellationToken.None);
        return (updated, true, summary);
    }

    /// <summary>One line with the key numbers and the window they were judged against.</summary>
    public static string Summarise(OverlapRecordResult r)
    {
        var o = r.Overlap;
        var text = string.Create(CultureInfo.InvariantCulture,
            $"{r.SiteA}–{r.SiteB}: overlap {o.Overlap:0.00} at lag {Ms(o.RefinedLagSeconds)} ms (allowed ±{r.AllowedLagSeconds * 1e3:0.00} ms), sign {(o.Sign > 0 ? "+1" : "−1")}");
        text += o.PValue is { } p
            ? string.Create(CultureInfo.InvariantCulture, $"; p = {p:G2} ({o.OffSourceOverlaps.Length} off-source trials)")
            : "; no off-source trials";
        return text;
    }

    private static string Ms(double seconds) => (seconds * 1e3).ToString("+0.00;−0.00", CultureInfo.InvariantCulture);

    private static (string Verdict, string Reason) Judge(OverlapResult o, bool within, bool atEdge, OverlapCheckParameters p)
    {
        var problems = new List<string>();
        if (o.Overlap < p.OverlapThreshold)
        {
            problems.Add(string.Create(CultureInfo.InvariantCulture, $"overlap {o.Overlap:0.00} is below {p.OverlapThreshold:0.##}"));
        }

        if (!within)
        {
            problems.Add(atEdge ? "the best lag is at the edge of the allowed window (the peak may lie outside it)" : "the lag is outside the allowed window");
        }

        bool weakP = o.PValue is { } pv && pv > p.PValueThreshold;
        if (problems.Count == 0 && !weakP)
        {
            var pText = o.PValue is { } q
                ? string.Create(CultureInfo.InvariantCulture, $", p = {q:G2} <= {p.PValueThreshold:G3}")
                : ", no off-source p-value asked";
            return ("consistent", string.Create(CultureInfo.InvariantCulture, $"overlap {o.Overlap:0.00} >= {p.OverlapThreshold:0.##}, lag inside the window") + pText);
        }

        if (problems.Count == 0)
        {
            return ("concern", string.Create(CultureInfo.InvariantCulture,
                $"overlap and lag pass, but off-source noise reaches this overlap too often: p = {o.PValue:G2} > {p.PValueThreshold:G3}"));
        }

        if (weakP)
        {
            problems.Add(string.Create(CultureInfo.InvariantCulture, $"p = {o.PValue:G2} > {p.PValueThreshold:G3}"));
        }

        return ("inconsistent", string.Join("; ", problems));
    }

    private static string SignNote(OverlapResult o, string a, string b)
    {
        string chosen = o.Sign > 0 ? $"sign +1: {b} lines up with {a} as it is" : $"sign −1: {b} is flipped to line up with {a}";
        return chosen + string.Create(CultureInfo.InvariantCulture,
            $". Other sign ({(o.Sign > 0 ? "−1" : "+1")}): best overlap {o.AlternativeOverlap:0.00} at lag {Ms(o.AlternativeLagSeconds)} ms. For a narrow-band signal a flip looks like a half-cycle shift; the antenna-response check says which sign the sites' orientations allow.");
    }

    private async Task<(double? Lag, string Rule)> NetworkLagAsync(string a, string b, double kSigma, CancellationToken ct)
    {
        var sites = (await network.GetAsync(ct)).Sites;
        var sa = sites.FirstOrDefault(s => string.Equals(s.Code, a, StringComparison.OrdinalIgnoreCase));
        var sb = sites.FirstOrDefault(s => string.Equals(s.Code, b, StringComparison.OrdinalIgnoreCase));
        if (sa is null || sb is null)
        {
            return (null, $"site {(sa is null ? a : b)} is not in the network, so the light-travel time is unknown");
        }

        var travel = Baseline.Between(sa, sb).LightTravelSeconds;
        var sigma = Math.Sqrt((sa.TimingUncertaintySeconds * sa.TimingUncertaintySeconds) + (sb.TimingUncertaintySeconds * sb.TimingUncertaintySeconds));
        var lag = travel + (kSigma * sigma);
        return (lag, string.Create(CultureInfo.InvariantCulture,
            $"±{lag * 1e3:0.00} ms = light-travel {a}–{b} {travel * 1e3:0.00} ms + {kSigma:0.#}σ combined timing uncertainty ({sigma * 1e3:0.###} ms)"));
    }

    private async Task<TimeSeries> ReadAsync(StrainPick pick, string name, CancellationToken ct)
    {
        var bytes = await files.ReadAsync(pick.Sha256, ct);
        try
        {
            if (!pick.IsHdf5)
            {
                using var reader = new StreamReader(new MemoryStream(bytes));
                return StrainTextReader.Read(reader);
            }

            var path = Path.Combine(Path.GetTempPath(), "er-h5-" + Guid.NewGuid().ToString("N") + ".h5");
            await File.WriteAllBytesAsync(path, bytes, ct);
            try
            {
                var start = pick.StartGps is { } s ? GpsTime.FromSeconds(s) : (GpsTime?)null;
                return Hdf5StrainReader.Read(path, new Hdf5StrainOptions(pick.Hdf5Dataset!, start, pick.SampleRateHz));
            }
            finally
            {
                File.Delete(path);
            }
        }
        catch (StrainFormatException ex)
        {
            throw new StrainFormatException(ex.LineNumber, $"{name}: {ex.Message}");
        }
        catch (Exception ex) when (ex is not (OperationCanceledException or OutOfMemoryException or StrainFormatException) && pick.IsHdf5)
        {
            throw new StrainFormatException(0, $"{name}: cannot be read as HDF5 ({ex.Message.Split(Environment.NewLine)[0]}).");
        }
    }

    private static (OverlapSiteMap Summary, string? Svg) Map(string site, TimeSeries strain, string name, GpsTime center)
    {
        var settings = new SpectrogramOptions();
        try
        {
            var (map, fit) = ChirpAnalysis.Run(strain, center, 2, 0.2, settings);
            double peak = 0, peakT = 0, peakF = 0;
            for (int i = 0; i < map.TimesSeconds.Length; i++)
            {
                for (int j = 0; j < map.FrequenciesHz.Length; j++)
                {
                    if (map.Energy[i][j] > peak)
                    {
                        (peak, peakT, peakF) = (map.Energy[i][j], map.TimesSeconds[i], map.FrequenciesHz[j]);
                    }
                }
            }

            var summary = new OverlapSiteMap(site, name, fit, null, map.TimesSeconds[0], map.TimesSeconds[^1], map.FrequenciesHz[0], map.FrequenciesHz[^1],
                map.ResolutionHz, settings.SegmentSeconds, peak, peakT, peakF);
            return (summary, TimeFrequencyPicture.Draw(map, fit, site));
        }
        catch (ArgumentException ex)
        {
            return (new OverlapSiteMap(site, name, null, ex.Message.Split(" (Parameter", 2)[0], 0, 0, 0, 0, 0, settings.SegmentSeconds, 0, 0, 0), null);
        }
    }

    /// <summary>
    /// Passes on only reports that move forward: the core's overlap stage reports through a <see cref="Progress{T}"/>, whose
    /// callbacks run later on the thread pool and can arrive after the next stage has begun.
    /// </summary>
    private static Action<double?, string>? Forward(Action<double?, string>? progress)
    {
        if (progress is null)
        {
            return null;
        }

        var gate = new Lock();
        double last = double.NegativeInfinity;
        return (fraction, text) =>
        {
            lock (gate)
            {
                if (fraction is { } f && f < last)
                {
                    return;
                }

                last = fraction ?? last;
                progress(fraction, text);
            }
        };
    }

    /// <summary>Reports on the calling thread (no synchronisation context hop, so values arrive in order).</summary>
    private sealed class Reporter(Action<double> report) : IProgress<double>
    {
        public void Report(double value) => report(value);
    }
}
