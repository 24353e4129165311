using System.Globalization;
using System.Security.Claims;
using EventReview.Core.Cases;
using EventReview.Core.Checklists;
using EventReview.Core.Evidence;
using EventReview.Core.Signal;
using EventReview.Core.Signal.Io;
using EventReview.Core.Signal.Overlap;
using EventReview.Core.Time;
using EventReview.Core.Timing;
using EventReview.Web.Auth;

namespace EventReview.Web.Services.Checks;

/// <summary>
/// Gathers the overlap check's inputs from a case (two attached strain files, the sites, the allowed lag from the network's
/// <see cref="PairWindow"/>), runs the check kind in Core (<see cref="OverlapReview"/>) and stores its result as a computation record.
/// Re-running with the same files, parameters and tool version adds nothing (<see cref="CheckRecords.SameRun"/>).
/// </summary>
public sealed class OverlapCheckService(CaseQueries cases, CaseWorkflow workflow, NetworkService network, CaseFiles files, CheckJobs jobs, IServiceScopeFactory scopes)
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
        var latest = CheckRecords.Latest(item.Computations, CheckKind.Overlap);
        if (CheckRecords.SameRun(latest, inputFingerprint, parametersJson))
        {
            return (c, false, latest.Summary);
        }

        progress?.Invoke(0.02, $"reading {nameA}");
        var a = await ReadAsync(parameters.FileA, nameA, ct);
        progress?.Invoke(0.08, $"reading {nameB}");
        var b = await ReadAsync(parameters.FileB, nameB, ct);
        var conditioning = new ConditioningOptions(resolved.BandLowHz, resolved.BandHighHz, PsdSegmentSeconds: resolved.PsdSegmentSeconds, NotchFrequenciesHz: resolved.NotchesHz);
        var options = new OverlapReviewOptions(GpsTime.FromSeconds(resolved.CenterGps!.Value), resolved.WindowSeconds, allowed, rule, conditioning,
            resolved.OffSourceTrials, resolved.OverlapThreshold, resolved.PValueThreshold);
        var arrivalA = c.Arrivals.FirstOrDefault(x => x.SiteCode == defaults.SiteA);
        var arrivalB = c.Arrivals.FirstOrDefault(x => x.SiteCode == defaults.SiteB);
        double? caseLag = arrivalA is not null && arrivalB is not null ? arrivalA.Arrival.SecondsSince(arrivalB.Arrival) : null;
        var result = await Task.Run(() => OverlapReview.Run(new OverlapReviewSite(defaults.SiteA, nameA, a), new OverlapReviewSite(defaults.SiteB, nameB, b), options, caseLag,
            (v, text) => progress?.Invoke(0.1 + (0.85 * v), text), ct), ct);
        progress?.Invoke(0.97, "storing the record");
        var updated = await workflow.AddComputationAsync(user, caseId, itemKey,
            now => new ComputationRecord(CheckKind.Overlap, parametersJson, inputFingerprint, CheckRecords.ToolVersion, CheckRecords.Serialize(result),
                result.Judgement!.Word, result.Summary, string.Join(CheckRecords.PictureSeparator, result.PicturesSvg), user.ToActor(), now), CancellationToken.None);
        return (updated, true, result.Summary);
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

        var window = PairWindow.For(sa, sb, kSigma);
        return (window.AllowedSeconds, window.Rule);
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
}
