namespace EventReview.Core.Environment;

/// <summary>
/// How EventReview names a sensor channel: plain words joined by slashes, site first,
/// <c>SITE/system/sensor-location[/axis]</c>, lower case with hyphens inside a part, for example
/// <c>AB/env/magnetometer-electronics-vault/x</c> or <c>KP/inst/actuator-readback</c> (system <c>env</c> for environmental
/// sensors, <c>inst</c> for the instrument's own auxiliary channels). Input files may name channels in any way (a channel is
/// matched exactly as written); this class only decides how a channel is shown and keyed together with its site.
/// </summary>
public static class ChannelName
{
    /// <summary>Separator between the parts of a channel name.</summary>
    public const char Separator = '/';

    /// <summary>
    /// The channel with its site: <paramref name="channel"/> unchanged when it already starts with the site code and a slash
    /// (case-insensitive), otherwise <c>SITE/channel</c> with the site in upper case. Used to show a channel and as the key of the
    /// per-channel tables (coupling functions, sensor series), so a channel named with or without its site prefix is one channel.
    /// </summary>
    /// <param name="site">Site code.</param>
    /// <param name="channel">Channel name as written in the input file.</param>
    public static string Qualified(string site, string channel)
    {
        ArgumentNullException.ThrowIfNull(site);
        ArgumentNullException.ThrowIfNull(channel);
        var code = site.Trim().ToUpperInvariant();
        return channel.StartsWith(code + Separator, StringComparison.OrdinalIgnoreCase) ? channel : code + Separator + channel;
    }

    /// <summary>The site code of a name made by <see cref="Qualified"/> (the part before the first slash).</summary>
    public static string SiteOf(string qualified)
    {
        ArgumentNullException.ThrowIfNull(qualified);
        var i = qualified.IndexOf(Separator, StringComparison.Ordinal);
        return i < 0 ? qualified : qualified[..i];
    }
}
