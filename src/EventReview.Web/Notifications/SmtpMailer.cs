using EventReview.Data.Notifications;
using MailKit.Net.Smtp;
using MimeKit;
using Microsoft.Extensions.Options;

namespace EventReview.Web.Notifications;

/// <summary>Sends e-mail messages of the outbox through the configured SMTP server (MailKit), one connection per pass.</summary>
public sealed class SmtpMailer(IOptions<NotificationOptions> options)
{
    /// <summary>
    /// Sends each message; returns per message null (sent) or the error. When the server cannot be reached every message
    /// gets that error, after one attempt to connect.
    /// </summary>
    public async Task<IReadOnlyList<string?>> SendAsync(IReadOnlyList<OutboxMessage> messages, CancellationToken ct)
    {
        var smtp = options.Value.Smtp;
        var results = new string?[messages.Count];
        using var client = new SmtpClient { Timeout = smtp.TimeoutSeconds * 1000 };
        try
        {
            await client.ConnectAsync(smtp.Host!, smtp.Port, smtp.SocketOptions, ct);
            if (!string.IsNullOrWhiteSpace(smtp.UserName))
            {
                await client.AuthenticateAsync(smtp.UserName, smtp.Password ?? string.Empty, ct);
            }
        }
        catch (Exception ex) when (ex is not OperationCanceledException || !ct.IsCancellationRequested)
        {
            Array.Fill(results, $"SMTP server {smtp.Host}:{smtp.Port} not reachable: {ex.Message}");
            return results;
        }

        for (var i = 0; i < messages.Count; i++)
        {
            try
            {
                await client.SendAsync(Mime(messages[i], smtp.From!), ct);
            }
            catch (Exception ex) when (ex is not OperationCanceledException || !ct.IsCancellationRequested)
            {
                results[i] = $"SMTP server {smtp.Host}:{smtp.Port} refused the message: {ex.Message}";
                if (!client.IsConnected)
                {
                    for (var j = i + 1; j < messages.Count; j++)
                    {
                        results[j] = results[i];
                    }

                    break;
                }
            }
        }

        if (client.IsConnected)
        {
            await client.DisconnectAsync(true, CancellationToken.None);
        }

        return results;
    }

    private static MimeMessage Mime(OutboxMessage m, string from)
    {
        var mime = new MimeMessage();
        mime.From.Add(MailboxAddress.Parse(from));
        mime.To.Add(MailboxAddress.Parse(m.Target));
        mime.Subject = m.Subject;
        mime.Headers.Add("Auto-Submitted", "auto-generated");
        mime.Headers.Add("X-EventReview-Event", m.Kind);
        mime.Body = new TextPart("plain") { Text = m.Body };
        return mime;
    }
}
