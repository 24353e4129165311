using System.Net.Http.Headers;
using System.Net.Http.Json;
using System.Text;
using System.Text.Json;
using System.Text.Json.Nodes;

namespace EventReview.Web.Tests.Fixtures;

/// <summary>Small helpers for calling the JSON API and reading its answers.</summary>
public static class ApiCalls
{
    /// <summary>Three arrivals at the demo sites, within a few ms of the case time.</summary>
    public static object OpenCaseBody(string candidateId, decimal gps = 1_400_000_000.125m, string checklist = "rapid-triage", string site = "KP") => new
    {
        candidateId,
        gpsTime = gps,
        search = "test-search",
        summary = "Opened by a test.",
        arrivals = new object[]
        {
            new { site, gpsTime = gps + 0.004m, snr = 9.5 },
            new { site = "AB", gpsTime = gps - 0.002m, snr = 7.0 },
        },
        checklist,
    };

    public static string NewCandidateId() => "TC-" + Guid.NewGuid().ToString("N")[..10];

    public static StringContent Json(string raw) => new(raw, Encoding.UTF8, "application/json");

    public static Task<HttpResponseMessage> OpenCaseAsync(this HttpClient client, object body) => client.PostAsJsonAsync("/api/cases", body);

    public static Task<HttpResponseMessage> AddNoteAsync(this HttpClient client, int caseId, string key, string text) =>
        client.PostAsJsonAsync($"/api/cases/{caseId}/items/{key}/notes", new { text });

    public static Task<HttpResponseMessage> AttachAsync(this HttpClient client, int caseId, string key, byte[] bytes, string fileName = "plot.bin", string? description = null)
    {
        var form = new MultipartFormDataContent();
        var file = new ByteArrayContent(bytes);
        file.Headers.ContentType = new MediaTypeHeaderValue("application/octet-stream");
        form.Add(file, "file", fileName);
        if (description is not null)
        {
            form.Add(new StringContent(description), "description");
        }

        return client.PostAsync($"/api/cases/{caseId}/items/{key}/attachments", form);
    }

    public static async Task<JsonNode> JsonAsync(this HttpResponseMessage response)
    {
        var text = await response.Content.ReadAsStringAsync();
        return JsonNode.Parse(text) ?? throw new JsonException("empty body");
    }

    /// <summary>The id of a case by candidate id (through GET /api/cases).</summary>
    public static async Task<int> CaseIdAsync(this HttpClient client, string candidateId)
    {
        var list = (await (await client.GetAsync($"/api/cases?q={Uri.EscapeDataString(candidateId)}")).JsonAsync())["items"]!.AsArray();
        return list.Single(c => (string?)c!["candidateId"] == candidateId)!["id"]!.GetValue<int>();
    }

    /// <summary>One item of a case as the API shows it.</summary>
    public static async Task<JsonNode> ItemAsync(this HttpClient client, int caseId, string key)
    {
        var c = await (await client.GetAsync($"/api/cases/{caseId}")).JsonAsync();
        return c["items"]!.AsArray().Single(i => (string?)i!["key"] == key)!;
    }
}
