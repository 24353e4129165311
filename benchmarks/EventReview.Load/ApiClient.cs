using System.Diagnostics;
using System.Globalization;
using System.Net.Http.Headers;
using System.Net.Http.Json;
using System.Text.Json;

namespace EventReview.Load;

/// <summary>The few API calls the load generator makes, each timed on the client and by the server (Server-Timing).</summary>
public sealed class ApiClient(HttpClient http, string token)
{
    /// <summary>One timed call: status, client-side milliseconds, server-side milliseconds (from Server-Timing) and the body when JSON.</summary>
    public sealed record Call(int Status, double ClientMs, double? ServerMs, JsonElement? Body, string? Error);

    public Task<Call> OpenCaseAsync(string candidateId, decimal gpsTime, string checklist, CancellationToken ct) =>
        SendAsync(HttpMethod.Post, "/api/cases", JsonContent.Create(new { candidateId, gpsTime, search = "load", summary = "Load-generator case.", checklist }), ct);

    public Task<Call> AddNoteAsync(int caseId, string item, string text, CancellationToken ct) =>
        SendAsync(HttpMethod.Post, $"/api/cases/{caseId}/items/{Uri.EscapeDataString(item)}/notes", JsonContent.Create(new { text }), ct, parse: false);

    public Task<Call> AttachAsync(int caseId, string item, byte[] bytes, string fileName, CancellationToken ct)
    {
        var form = new MultipartFormDataContent();
        var file = new ByteArrayContent(bytes);
        file.Headers.ContentType = new MediaTypeHeaderValue("application/octet-stream");
        form.Add(file, "file", fileName);
        form.Add(new StringContent("load-generator file"), "description");
        return SendAsync(HttpMethod.Post, $"/api/cases/{caseId}/items/{Uri.EscapeDataString(item)}/attachments", form, ct, parse: false);
    }

    public Task<Call> GetAsync(string path, CancellationToken ct) => SendAsync(HttpMethod.Get, path, null, ct);

    /// <summary>Sends and times one request; the body is parsed only when <paramref name="parse"/> (the write load does not need it, and the parsing would take CPU from the server on the same machine).</summary>
    private async Task<Call> SendAsync(HttpMethod method, string path, HttpContent? content, CancellationToken ct, bool parse = true)
    {
        using var request = new HttpRequestMessage(method, path) { Content = content };
        request.Headers.Authorization = new AuthenticationHeaderValue("Bearer", token);
        var t0 = Stopwatch.GetTimestamp();
        try
        {
            using var response = await http.SendAsync(request, ct);
            var bytes = await response.Content.ReadAsByteArrayAsync(ct);
            var ms = Stopwatch.GetElapsedTime(t0).TotalMilliseconds;
            JsonElement? body = null;
            if (parse && bytes.Length > 0 && response.Content.Headers.ContentType?.MediaType?.Contains("json", StringComparison.Ordinal) == true)
            {
                body = JsonDocument.Parse(bytes).RootElement.Clone();
            }

            var error = response.IsSuccessStatusCode ? null : System.Text.Encoding.UTF8.GetString(bytes, 0, Math.Min(bytes.Length, 300));
            return new Call((int)response.StatusCode, ms, ServerMs(response), body, error);
        }
        catch (HttpRequestException ex)
        {
            return new Call(0, Stopwatch.GetElapsedTime(t0).TotalMilliseconds, null, null, ex.Message);
        }
    }

    private static double? ServerMs(HttpResponseMessage response)
    {
        if (!response.Headers.TryGetValues("Server-Timing", out var values))
        {
            return null;
        }

        foreach (var part in values.SelectMany(v => v.Split(';', ',')))
        {
            var p = part.Trim();
            if (p.StartsWith("dur=", StringComparison.Ordinal) && double.TryParse(p[4..], NumberStyles.Float, CultureInfo.InvariantCulture, out var ms))
            {
                return ms;
            }
        }

        return null;
    }
}
