using System.Net;
using System.Net.Sockets;

namespace EventReview.Web.Notifications;

/// <summary>
/// Which webhook addresses are acceptable (<see cref="WebhookOptions"/>): absolute http(s) (https unless allowed
/// otherwise), and, unless private addresses are allowed, never one that resolves to this machine or a private network.
/// The check is made when the address is saved (for IP literals) and again when connecting (for the addresses a name
/// resolves to at that moment), so a name that changes to an inside address later is still refused.
/// </summary>
public static class WebhookTarget
{
    /// <summary>Null when <paramref name="url"/> may be saved, else the reason.</summary>
    public static string? Problem(string? url, WebhookOptions options)
    {
        if (string.IsNullOrWhiteSpace(url))
        {
            return null;
        }

        if (!options.Enabled)
        {
            return "Webhooks are switched off on this server.";
        }

        if (url.Length > Data.Notifications.NotificationSettings.MaxUrlLength)
        {
            return $"The webhook address is longer than {Data.Notifications.NotificationSettings.MaxUrlLength} characters.";
        }

        if (!Uri.TryCreate(url.Trim(), UriKind.Absolute, out var uri) || uri.Scheme is not ("https" or "http") || !string.IsNullOrEmpty(uri.UserInfo))
        {
            return "The webhook address must be an absolute http or https address without a user name or password in it, e.g. https://hooks.example.org/eventreview.";
        }

        if (options.RequireHttps && uri.Scheme != "https")
        {
            return "The webhook address must use https on this server.";
        }

        if (!options.AllowPrivateAddresses && (uri.IsLoopback || (IPAddress.TryParse(uri.DnsSafeHost, out var ip) && IsPrivate(ip))))
        {
            return "The webhook address points to this machine or a private network, which this server does not call.";
        }

        return null;
    }

    /// <summary>
    /// True for addresses a webhook must not reach from the server: loopback, unspecified, private (RFC 1918), shared
    /// (RFC 6598), link-local (RFC 3927, incl. cloud metadata at 169.254.169.254), unique local IPv6 (RFC 4193),
    /// link-local IPv6, and IPv4-mapped forms of these.
    /// </summary>
    public static bool IsPrivate(IPAddress address)
    {
        if (address.IsIPv4MappedToIPv6)
        {
            address = address.MapToIPv4();
        }

        if (IPAddress.IsLoopback(address) || address.Equals(IPAddress.Any) || address.Equals(IPAddress.IPv6Any) || address.Equals(IPAddress.IPv6None))
        {
            return true;
        }

        if (address.AddressFamily == AddressFamily.InterNetworkV6)
        {
            var b = address.GetAddressBytes();
            return (b[0] & 0xFE) == 0xFC || address.IsIPv6LinkLocal || address.IsIPv6SiteLocal;
        }

        var v4 = address.GetAddressBytes();
        return v4[0] switch
        {
            0 or 10 or 127 => true,
            100 => v4[1] is >= 64 and <= 127,
            169 => v4[1] == 254,
            172 => v4[1] is >= 16 and <= 31,
            192 => v4[1] == 168,
            _ => false,
        };
    }

    /// <summary>The connection step of the webhook client: resolves the name and refuses private addresses unless allowed.</summary>
    public static Func<SocketsHttpConnectionContext, CancellationToken, ValueTask<Stream>> Connect(bool allowPrivate) => async (context, ct) =>
    {
        var host = context.DnsEndPoint.Host;
        var addresses = IPAddress.TryParse(host, out var literal) ? [literal] : await Dns.GetHostAddressesAsync(host, ct);
        var allowed = allowPrivate ? addresses : addresses.Where(a => !IsPrivate(a)).ToArray();
        if (allowed.Length == 0)
        {
            throw new HttpRequestException($"'{host}' resolves only to addresses on this machine or a private network, which this server does not call.");
        }

        var socket = new Socket(SocketType.Stream, ProtocolType.Tcp) { NoDelay = true };
        try
        {
            await socket.ConnectAsync(allowed, context.DnsEndPoint.Port, ct);
            return new NetworkStream(socket, ownsSocket: true);
        }
        catch
        {
            socket.Dispose();
            throw;
        }
    };
}
