namespace EventReview.Web.Security;

/// <summary>The client address used for limits and the sign-in audit.</summary>
public static class ClientAddress
{
    /// <summary>
    /// <see cref="ConnectionInfo.RemoteIpAddress"/> as text ("unknown" when absent, as in in-memory tests). Behind a
    /// proxy this is the real client only if forwarded-headers handling runs earlier in the pipeline.
    /// </summary>
    public static string Of(HttpContext context)
    {
        var ip = context.Connection.RemoteIpAddress;
        if (ip is null)
        {
            return "unknown";
        }

        return (ip.IsIPv4MappedToIPv6 ? ip.MapToIPv4() : ip).ToString();
    }
}
