using System.Net;

namespace EventReview.Web.Operations;

/// <summary>The client addresses and networks allowed to read <c>/metrics</c> (see <see cref="TelemetryOptions.MetricsClients"/>).</summary>
public sealed class MetricsClients(IReadOnlyList<IPAddress> addresses, IReadOnlyList<System.Net.IPNetwork> networks)
{
    /// <summary>True when <paramref name="client"/> is listed or inside a listed network; an unknown address is never allowed.</summary>
    public bool Allows(IPAddress? client)
    {
        if (client is null)
        {
            return false;
        }

        // A dual-stack listener reports an IPv4 client as ::ffff:a.b.c.d.
        var plain = client.IsIPv4MappedToIPv6 ? client.MapToIPv4() : client;
        return addresses.Any(a => a.Equals(plain)) || networks.Any(n => n.Contains(plain));
    }
}
