using System.Net.Http.Headers;
using System.Text;
using EventReview.Core.Notifications;
using EventReview.Data;
using EventReview.Data.Notifications;
using Microsoft.EntityFrameworkCore;

namespace EventReview.Web.Notifications;

/// <summary>
/// POSTs webhook messages of the outbox: the JSON body as composed, signed with the person's current webhook secret
/// (<see cref="WebhookSignature"/>: <c>X-EventReview-Timestamp</c> and <c>X-EventReview-Signature</c>), with the
/// message id in <c>X-EventReview-Delivery</c> so that a receiver can drop a repeat. Any 2xx answer counts as delivered.
/// </summary>
public sealed class WebhookSender(IHttpClientFactory clients, IDbContextFactory<AppDbContext> dbFactory, TimeProvider clock)
{
    public const string ClientName = "eventreview-webhooks";

    /// <summary>Null when delivered, else the error.</summary>
    public async Task<string?> SendAsync(OutboxMessage m, CancellationToken ct)
    {
        await using var db = await dbFactory.CreateDbContextAsync(ct);
        var secret = await db.NotificationSettings.AsNoTracking().Where(s => s.UserId == m.UserId).Select(s => s.WebhookSecret).FirstOrDefaultAsync(ct);
        if (string.IsNullOrEmpty(secret))
        {
            return "The person no longer has a webhook secret (webhook removed from the profile).";
        }

        var timestamp = clock.GetUtcNow().ToUnixTimeSeconds();
        using var request = new HttpRequestMessage(HttpMethod.Post, m.Target) { Content = new StringContent(m.Body, Encoding.UTF8) };
        request.Content.Headers.ContentType = new MediaTypeHeaderValue("application/json") { CharSet = "utf-8" };
        request.Headers.Add(WebhookSignature.TimestampHeader, timestamp.ToString(System.Globalization.CultureInfo.InvariantCulture));
        request.Headers.Add(WebhookSignature.SignatureHeader, WebhookSignature.Sign(secret, timestamp, m.Body));
        request.Headers.Add("X-EventReview-Delivery", m.Id.ToString(System.Globalization.CultureInfo.InvariantCulture));
        request.Headers.Add("X-EventReview-Event", m.Kind);
        try
        {
            using var response = await clients.CreateClient(ClientName).SendAsync(request, ct);
            return response.IsSuccessStatusCode ? null : $"The receiver answered {(int)response.StatusCode} {response.ReasonPhrase}.";
        }
        catch (Exception ex) when (ex is HttpRequestException or TaskCanceledException && !ct.IsCancellationRequested)
        {
            return $"Webhook {new Uri(m.Target).GetLeftPart(UriPartial.Authority)} not reachable: {ex.Message}";
        }
    }
}
