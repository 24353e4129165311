using EventReview.Core.Configuration;

namespace EventReview.Core.Records;

/// <summary>
/// A configuration record of the case as stored: whether it is frozen, its stored fingerprint, the fingerprint its
/// content recomputes to (<see cref="ConfigurationCanonical"/>), its detail hash (<see cref="CaseFacts.ConfigurationDetail(Configuration.ConfigurationSnapshot)"/>).
/// </summary>
public sealed record StoredConfiguration(string Id, string SiteCode, bool IsFrozen, string? Fingerprint, string? Recomputed, string Detail)
{
    public static StoredConfiguration Of(ConfigurationSnapshot s)
    {
        ArgumentNullException.ThrowIfNull(s);
        string? recomputed = null;
        if (s.IsFrozen && s.FreezeFrom is { } from && s.FreezeUntil is { } until && s.FreezeReason is not null)
        {
            try
            {
                recomputed = ConfigurationCanonical.Fingerprint(s.SiteCode, s.Label, from, until, s.FreezeReason, s.Items);
            }
            catch (System.Text.Json.JsonException)
            {
                recomputed = "(its items cannot be read)";
            }
        }

        return new StoredConfiguration(s.Id.ToString(System.Globalization.CultureInfo.InvariantCulture), s.SiteCode, s.IsFrozen, s.Fingerprint, recomputed,
            CaseFacts.ConfigurationDetail(s));
    }
}
