using System.Text;
using System.Text.Json;
using System.Text.Json.Nodes;
using EventReview.Web.Tests.Fixtures;

namespace EventReview.Web.Tests.Integrity;

/// <summary>
/// Generates the bad-input corpus over every endpoint: wrong types, non-finite and out-of-range numbers, nulls in
/// arrays, oversize strings, invisible and bidirectional characters, malformed JSON and multipart bodies, wrong content
/// types, missing, expired, revoked and under-scoped tokens, cross-origin cookie writes, unsupported methods, and hostile
/// sign-in forms. Each request names the status it must get where the contract pins one.
/// </summary>
public static partial class BadInputCorpus
{
    /// <summary>Where the corpus aims: an open case and one of its items, a closed case and one of its items.</summary>
    public sealed record Targets(int CaseId, string ItemKey, int ClosedCaseId, string ClosedItemKey, string SignInEmail, string SignInPassword);

    public const string CasesPath = "/api/cases";

    public static IReadOnlyList<CorpusRequest> All(Targets t) =>
    [
        .. OpenCase(), .. Notes(t), .. Attachments(t), .. Reads(t), .. Refused(t), .. CrossOrigin(t), .. Methods(t), .. SignIn(t),
    ];

    /// <summary>A valid case body (a fresh candidate id each time), as a JSON tree to spoil.</summary>
    public static JsonObject ValidCase() => new()
    {
        ["candidateId"] = ApiCalls.NewCandidateId(),
        ["gpsTime"] = 1_400_000_000.125m,
        ["search"] = "corpus",
        ["summary"] = "Sent by the bad-input corpus.",
        ["arrivals"] = new JsonArray(
            new JsonObject { ["site"] = "KP", ["gpsTime"] = 1_400_000_000.129m, ["snr"] = 9.5 },
            new JsonObject { ["site"] = "AB", ["gpsTime"] = 1_400_000_000.123m, ["snr"] = 7.0 }),
        ["checklist"] = "rapid-triage",
    };

    /// <summary>Raw JSON of a value (numbers written as given: 1e400 stays 1e400).</summary>
    private static JsonNode? Raw(string json) => JsonNode.Parse(json);

    private static readonly string Bidi = "TC-\u202Egpj.exe";

    /// <summary>Strings no id may hold, with what they are.</summary>
    private static readonly (string What, string Value)[] HiddenIds =
    [
        ("a right-to-left override", Bidi), ("a zero-width space", "TC-\u200B0001"), ("a byte-order mark", "\uFEFFTC-0001"),
        ("a left-to-right isolate", "TC-\u20660001\u2069"), ("a NUL", "TC-\u00000001"), ("a line separator", "TC-\u20280001"),
        ("a Hangul filler", "TC-\u31640001"), ("a variation selector", "TC-0\uFE0F001"), ("a soft hyphen", "TC-\u00AD0001"),
        ("an escape character", "TC-\u001B[31m0001"),
    ];

    /// <summary>Values of the wrong JSON type for a field that wants <paramref name="kind"/> ("string", "number", "array").</summary>
    private static IEnumerable<(string What, string Json)> WrongTypes(string kind)
    {
        if (kind != "string")
        {
            yield return ("a string", "\"9.5\"");
        }

        if (kind != "number")
        {
            yield return ("a number", "42");
        }

        yield return ("true", "true");
        yield return ("an object", "{}");
        if (kind != "array")
        {
            yield return ("an array", "[]");
        }
    }

    private static IEnumerable<CorpusRequest> OpenCase()
    {
        var bodies = new List<(string What, JsonObject Body, int Status, string? Field)>();

        void Set(string what, Action<JsonObject> spoil, int status, string? field)
        {
            var b = ValidCase();
            spoil(b);
            bodies.Add((what, b, status, field));
        }

        JsonObject Arrival(JsonObject b) => b["arrivals"]![0]!.AsObject();

        foreach (var (what, json) in WrongTypes("string"))
        {
            Set($"candidateId as {what}", b => b["candidateId"] = Raw(json), 400, "candidateId");
            Set($"search as {what}", b => b["search"] = Raw(json), 400, "search");
            Set($"checklist as {what}", b => b["checklist"] = Raw(json), 400, "checklist");
            Set($"arrival site as {what}", b => Arrival(b)["site"] = Raw(json), 400, "arrivals[0].site");
        }

        foreach (var (what, json) in WrongTypes("number"))
        {
            Set($"gpsTime as {what}", b => b["gpsTime"] = Raw(json), 400, "gpsTime");
            Set($"snr as {what}", b => Arrival(b)["snr"] = Raw(json), 400, "arrivals[0].snr");
            Set($"arrival gpsTime as {what}", b => Arrival(b)["gpsTime"] = Raw(json), 400, "arrivals[0].gpsTime");
        }

        foreach (var (what, json) in WrongTypes("array"))
        {
            Set($"arrivals as {what}", b => b["arrivals"] = Raw(json), 400, "arrivals");
        }

        foreach (var number in (string[])["1e308", "-1e308", "1e400", "-1e400", "-1", "-0.000001", "10000.001", "1e5", "3.4e38", "1.7976931348623157e308"])
        {
            Set($"snr {number}", b => Arrival(b)["snr"] = Raw(number), 422, "arrivals[0].snr");
        }

        foreach (var number in (string[])["1e308", "-1e308", "1e400", "1e30", "9.2e9", "9.3e9", "2000000000", "-1", "0", "-0.5", "79228162514264337593543950336"])
        {
            Set($"gpsTime {number}", b => b["gpsTime"] = Raw(number), 422, "gpsTime");
            Set($"arrival gpsTime {number}", b => Arrival(b)["gpsTime"] = Raw(number), 422, "arrivals[0].gpsTime");
        }

        Set("arrival 2 s from the case time", b => Arrival(b)["gpsTime"] = 1_400_000_002.125m, 422, "arrivals");
        Set("gpsTime missing", b => b.Remove("gpsTime"), 422, "gpsTime");
        Set("gpsTime null", b => b["gpsTime"] = null, 422, "gpsTime");
        Set("arrival gpsTime null", b => Arrival(b)["gpsTime"] = null, 422, "arrivals[0].gpsTime");
        Set("candidateId missing", b => b.Remove("candidateId"), 422, "candidateId");
        Set("candidateId null", b => b["candidateId"] = null, 422, "candidateId");
        Set("candidateId empty", b => b["candidateId"] = "", 422, "candidateId");
        Set("candidateId blank", b => b["candidateId"] = "   ", 422, "candidateId");
        Set("candidateId of 129 characters", b => b["candidateId"] = new string('C', 129), 422, "candidateId");
        Set("candidateId of 500,000 characters", b => b["candidateId"] = new string('C', 500_000), 422, "candidateId");
        foreach (var (what, value) in HiddenIds)
        {
            Set($"candidateId with {what}", b => b["candidateId"] = value, 422, "candidateId");
        }

        Set("search of 201 characters", b => b["search"] = new string('s', 201), 422, "search");
        Set("summary of 20,001 characters", b => b["summary"] = new string('s', 20_001), 422, "summary");
        Set("summary of 900,000 characters", b => b["summary"] = new string('s', 900_000), 422, "summary");
        Set("unknown checklist", b => b["checklist"] = "no-such-template", 422, "checklist");
        Set("checklist of 10,000 characters", b => b["checklist"] = new string('k', 10_000), 422, "checklist");
        Set("arrival site unknown", b => Arrival(b)["site"] = "ZZ", 422, "arrivals[0].site");
        Set("arrival site empty", b => Arrival(b)["site"] = "", 422, "arrivals[0].site");
        Set("arrival site null", b => Arrival(b)["site"] = null, 422, "arrivals[0].site");
        Set("arrival site with an override", b => Arrival(b)["site"] = "K\u202EP", 422, "arrivals[0].site");
        Set("arrival site of 5,000 characters", b => Arrival(b)["site"] = new string('K', 5_000), 422, "arrivals[0].site");
        Set("the same site twice", b => b["arrivals"]![1]!["site"] = "KP", 422, "arrivals");
        Set("arrivals [null]", b => b["arrivals"] = Raw("[null]"), 400, "arrivals[0]");
        Set("arrivals [arrival, null]", b => b["arrivals"]!.AsArray().Add(null), 400, "arrivals[2]");
        Set("arrivals [null, null, null]", b => b["arrivals"] = Raw("[null, null, null]"), 400, "arrivals[0]");
        Set("arrivals [1]", b => b["arrivals"] = Raw("[1]"), 400, "arrivals[0]");
        Set("arrivals [[]]", b => b["arrivals"] = Raw("[[]]"), 400, "arrivals[0]");
        Set("arrivals [\"KP\"]", b => b["arrivals"] = Raw("[\"KP\"]"), 400, "arrivals[0]");

        foreach (var who in (string[])[Who.TokenOpen, Who.Coordinator])
        {
            foreach (var (what, body, status, field) in bodies)
            {
                var text = body.ToJsonString();
                yield return new CorpusRequest("POST /api/cases", what, who, HttpMethod.Post, CasesPath)
                {
                    Body = () => ApiCalls.Json(text), Expected = status, Field = field,
                };
            }

            foreach (var (what, text, status) in MalformedJson(ValidCase().ToJsonString()))
            {
                yield return new CorpusRequest("POST /api/cases", what, who, HttpMethod.Post, CasesPath) { Body = () => Bytes(text, "application/json"), Expected = status };
            }

            foreach (var (what, contentType, status) in WrongContentTypes)
            {
                var text = ValidCase().ToJsonString();
                yield return new CorpusRequest("POST /api/cases", $"content type {what}", who, HttpMethod.Post, CasesPath)
                {
                    Body = () => Bytes(Encoding.UTF8.GetBytes(text), contentType), Expected = status,
                };
            }
        }
    }

    /// <summary>Bodies that are not well-formed JSON (or not UTF-8, or too large), each built from a valid body, with the answer each gets.</summary>
    private static IEnumerable<(string What, byte[] Body, int Status)> MalformedJson(string valid)
    {
        byte[] U(string s) => Encoding.UTF8.GetBytes(s);
        string With(string member) => valid[..^1] + ", " + member + "}";
        yield return ("truncated in the middle", U(valid[..(valid.Length / 2)]), 400);
        yield return ("truncated by one byte", U(valid[..^1]), 400);
        yield return ("empty body", [], 400);
        yield return ("the literal null", U("null"), 400);
        yield return ("an array instead of an object", U("[" + valid + "]"), 400);
        yield return ("a bare number", U("42"), 400);
        yield return ("a bare string", U("\"text\""), 400);
        yield return ("trailing comma", U(valid[..^1] + ",}"), 400);
        yield return ("trailing text", U(valid + " and more"), 400);
        yield return ("two objects", U(valid + valid), 400);
        yield return ("single quotes", U(valid.Replace('"', '\'')), 400);
        yield return ("a comment", U("/* note */" + valid), 400);
        yield return ("NaN literal", U(With("\"n\": NaN")), 400);
        yield return ("Infinity literal", U(With("\"n\": Infinity")), 400);
        yield return ("-Infinity literal", U(With("\"n\": -Infinity")), 400);
        yield return ("a leading plus", U(With("\"n\": +9.5")), 400);
        yield return ("hexadecimal number", U(With("\"n\": 0x10")), 400);
        yield return ("a number with a trailing dot", U(With("\"n\": 9.")), 400);
        yield return ("nested 5,000 deep", U(With("\"x\": " + new string('[', 5000) + new string(']', 5000))), 400);
        yield return ("a raw control character in a string", U(With("\"n\": \"a\u0001b\"")), 400);
        yield return ("not UTF-8 (Latin-1 byte)", [.. U(valid[..^1]), .. U(", \"n\": \"caf"), 0xE9, .. U("\"}")], 400);
        yield return ("an unpaired surrogate escape in a field", U(valid.Replace("corpus", "cor\\ud800pus")), 400);
        yield return ("UTF-16 bytes", Encoding.Unicode.GetBytes(valid), 400);
        yield return ("a 2 MB body", U(With("\"pad\": \"" + new string('p', 2 * 1024 * 1024) + "\"")), 413);
    }

    /// <summary>Content types that are not JSON, and the answer each gets.</summary>
    private static readonly (string What, string? ContentType, int Status)[] WrongContentTypes =
    [
        ("missing", null, 415), ("text/plain", "text/plain", 415), ("form-urlencoded", "application/x-www-form-urlencoded", 415),
        ("multipart", "multipart/form-data; boundary=x", 415), ("application/xml", "application/xml", 415), ("text/json", "text/json", 415),
        ("application/jsonx", "application/jsonx", 415), ("a malformed header value", "json", 415), ("octet-stream", "application/octet-stream", 415),
    ];

    private static ByteArrayContent Bytes(byte[] body, string? contentType)
    {
        var content = new ByteArrayContent(body);
        if (contentType is not null)
        {
            content.Headers.TryAddWithoutValidation("Content-Type", contentType);
        }

        return content;
    }

    private static IEnumerable<CorpusRequest> Notes(Targets t)
    {
        var path = $"/api/cases/{t.CaseId}/items/{t.ItemKey}/notes";
        const string endpoint = "POST /api/cases/{id}/items/{key}/notes";
        foreach (var who in (string[])[Who.TokenEvidence, Who.Reviewer])
        {
            foreach (var (what, json) in WrongTypes("string"))
            {
                yield return Note(who, $"text as {what}", path, $"{{\"text\": {json}}}", 400, "text");
            }

            yield return Note(who, "text null", path, "{\"text\": null}", 422, "text");
            yield return Note(who, "text missing", path, "{}", 422, "text");
            yield return Note(who, "text empty", path, "{\"text\": \"\"}", 422, "text");
            yield return Note(who, "text blank", path, "{\"text\": \" \\n\\t \"}", 422, "text");
            yield return Note(who, "text of 100,001 characters", path, JsonSerializer.Serialize(new { text = new string('n', 100_001) }), 422, "text");
            yield return Note(who, "to a case that does not exist", $"/api/cases/987654/items/{t.ItemKey}/notes", "{\"text\": \"x\"}", 404, null);
            yield return Note(who, "to an item that does not exist", $"/api/cases/{t.CaseId}/items/no.such.item/notes", "{\"text\": \"x\"}", 404, null);
            yield return Note(who, "to an item key with an override", $"/api/cases/{t.CaseId}/items/{Uri.EscapeDataString(t.ItemKey + "\u202E")}/notes", "{\"text\": \"x\"}", 404, null);
            yield return Note(who, "to an item key of 3,000 characters", $"/api/cases/{t.CaseId}/items/{new string('k', 3000)}/notes", "{\"text\": \"x\"}", 404, null);
            yield return Note(who, "to a case id past int", $"/api/cases/99999999999/items/{t.ItemKey}/notes", "{\"text\": \"x\"}", 404, null);
            yield return Note(who, "to a case id that is not a number", $"/api/cases/abc/items/{t.ItemKey}/notes", "{\"text\": \"x\"}", 404, null);
            yield return Note(who, "to a closed case", $"/api/cases/{t.ClosedCaseId}/items/{t.ClosedItemKey}/notes", "{\"text\": \"late\"}", 409, null);
            foreach (var (what, body, status) in MalformedJson("{\"text\": \"corpus note\"}"))
            {
                yield return new CorpusRequest(endpoint, what, who, HttpMethod.Post, path) { Body = () => Bytes(body, "application/json"), Expected = status };
            }

            foreach (var (what, contentType, status) in WrongContentTypes)
            {
                yield return new CorpusRequest(endpoint, $"content type {what}", who, HttpMethod.Post, path)
                {
                    Body = () => Bytes("{\"text\": \"x\"}"u8.ToArray(), contentType), Expected = status,
                };
            }
        }
    }

    private static CorpusRequest Note(string who, string what, string path, string json, int status, string? field) =>
        new("POST /api/cases/{id}/items/{key}/notes", what, who, HttpMethod.Post, path) { Body = () => ApiCalls.Json(json), Expected = status, Field = field };
}
