using System.Net;

namespace EventReview.Web.Operations;

/// <summary>Reads a configured list of IP addresses and networks (<c>10.0.0.0/8</c>), as the proxy and metrics settings take them.</summary>
public static class AddressList
{
    /// <summary>The addresses and networks of <paramref name="entries"/> (blank entries skipped); a bad entry throws, naming <paramref name="setting"/> and the entry.</summary>
    public static (List<IPAddress> Addresses, List<System.Net.IPNetwork> Networks) Parse(IEnumerable<string> entries, string setting)
    {
        var addresses = new List<IPAddress>();
        var networks = new List<System.Net.IPNetwork>();
        foreach (var entry in entries.Where(e => !string.IsNullOrWhiteSpace(e)).Select(e => e.Trim()))
        {
            if (entry.Contains('/') && System.Net.IPNetwork.TryParse(entry, out var network))
            {
                networks.Add(network);
            }
            else if (IPAddress.TryParse(entry, out var address))
            {
                addresses.Add(address);
            }
            else
            {
                throw new ArgumentException($"{setting} entry '{entry}' is neither an IP address nor a network like 10.0.0.0/8.", nameof(entries));
            }
        }

        return (addresses, networks);
    }
}
