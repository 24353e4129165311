using MimeKit;

namespace EventReview.Web.Notifications;

/// <summary>The SMTP server e-mail goes through (<c>EventReview:Notifications:Smtp</c>); no host: no e-mail.</summary>
public sealed class SmtpOptions
{
    public string? Host { get; set; }

    /// <summary>Default 587 (submission with STARTTLS).</summary>
    public int Port { get; set; } = 587;

    /// <summary>
    /// <c>StartTls</c> (default: refuse a server that does not offer it), <c>SslOnConnect</c> (port 465),
    /// <c>None</c> (plain, only for a relay on this machine or in tests) or <c>Auto</c> (TLS when offered).
    /// </summary>
    public string Security { get; set; } = "StartTls";

    /// <summary>Account at the server, if it needs one (with <see cref="Password"/>, kept in the environment file).</summary>
    public string? UserName { get; set; }

    public string? Password { get; set; }

    /// <summary>Sender address, e.g. <c>EventReview &lt;review-noreply@example.org&gt;</c>. Required with a host.</summary>
    public string? From { get; set; }

    /// <summary>Seconds to wait for the server (default 30).</summary>
    public int TimeoutSeconds { get; set; } = 30;

    /// <summary>True when a host is set.</summary>
    public bool Enabled => !string.IsNullOrWhiteSpace(Host);

    /// <summary>MailKit's name for <see cref="Security"/>.</summary>
    public MailKit.Security.SecureSocketOptions SocketOptions => Security.Trim().ToLowerInvariant() switch
    {
        "none" => MailKit.Security.SecureSocketOptions.None,
        "sslonconnect" => MailKit.Security.SecureSocketOptions.SslOnConnect,
        "auto" => MailKit.Security.SecureSocketOptions.Auto,
        _ => MailKit.Security.SecureSocketOptions.StartTls,
    };

    public IEnumerable<string> Problems(string section)
    {
        if (!Enabled)
        {
            yield break;
        }

        if (string.IsNullOrWhiteSpace(From) || !MailboxAddress.TryParse(From, out _))
        {
            yield return $"{section}:From '{From}' is not a sender address; give one such as 'EventReview <review-noreply@example.org>'.";
        }

        if (Port is < 1 or > 65535)
        {
            yield return $"{section}:Port {Port} is not a port number.";
        }

        if (Security.Trim().ToLowerInvariant() is not ("starttls" or "sslonconnect" or "none" or "auto"))
        {
            yield return $"{section}:Security '{Security}' is not one of StartTls, SslOnConnect, None, Auto.";
        }

        if (string.IsNullOrWhiteSpace(UserName) != string.IsNullOrWhiteSpace(Password))
        {
            yield return $"{section}:UserName and {section}:Password go together; give both or neither.";
        }

        if (TimeoutSeconds is < 1 or > 300)
        {
            yield return $"{section}:TimeoutSeconds {TimeoutSeconds} is outside 1 to 300.";
        }
    }
}
