using System.Net.Http.Headers;
using System.Text;
using EventReview.Web.Tests.Fixtures;

namespace EventReview.Web.Tests.Integrity;

/// <summary>The corpus, continued: uploads, reads, refused callers, cross-origin writes, methods and the sign-in form.</summary>
public static partial class BadInputCorpus
{
    private const string Boundary = "corpus-boundary-7f3a";

    private static IEnumerable<CorpusRequest> Attachments(Targets t)
    {
        var path = $"/api/cases/{t.CaseId}/items/{t.ItemKey}/attachments";
        const string endpoint = "POST /api/cases/{id}/items/{key}/attachments";
        byte[] file = [.. "corpus file "u8];

        static string Part(string name, string body, string? fileName = null, string contentType = "application/octet-stream") =>
            $"--{Boundary}\r\nContent-Disposition: form-data; name=\"{name}\"{(fileName is null ? string.Empty : $"; filename=\"{fileName}\"")}\r\n" +
            (fileName is null ? string.Empty : $"Content-Type: {contentType}\r\n") + $"\r\n{body}\r\n";

        var filePart = Part("file", "corpus file bytes", "corpus.txt");
        var end = $"--{Boundary}--\r\n";
        var multipart = $"multipart/form-data; boundary={Boundary}";
        var cases = new List<(string What, Func<HttpContent> Body, int Status, string? Field)>
        {
            ("no content type", () => Bytes(Encoding.UTF8.GetBytes(filePart + end), null), 415, null),
            ("JSON instead of a form", () => ApiCalls.Json("{\"file\": \"x\"}"), 415, null),
            ("text/plain", () => Bytes(file, "text/plain"), 415, null),
            ("form-urlencoded", () => Bytes("file=x"u8.ToArray(), "application/x-www-form-urlencoded"), 415, null),
            ("multipart without a boundary", () => Bytes(Encoding.UTF8.GetBytes(filePart + end), "multipart/form-data"), 400, null),
            ("multipart with an empty boundary", () => Bytes(Encoding.UTF8.GetBytes(filePart + end), "multipart/form-data; boundary="), 400, null),
            ("a boundary of 200 characters", () => Bytes(Encoding.UTF8.GetBytes(filePart + end), $"multipart/form-data; boundary={new string('b', 200)}"), 400, null),
            ("truncated before the closing boundary", () => Bytes(Encoding.UTF8.GetBytes(filePart[..^10]), multipart), 400, null),
            ("truncated in the part headers", () => Bytes(Encoding.UTF8.GetBytes($"--{Boundary}\r\nContent-Disposition: form-da"), multipart), 400, null),
            ("a body that is not multipart at all", () => Bytes(Encoding.UTF8.GetBytes("this is not a form"), multipart), 400, null),
            ("2,000 fields (over the form's limit)", () => Bytes(Encoding.UTF8.GetBytes(string.Concat(Enumerable.Range(0, 2000).Select(i => Part($"f{i}", "v"))) + filePart + end), multipart), 400, null),
            ("a part header line of 20,000 characters", () => Bytes(Encoding.UTF8.GetBytes($"--{Boundary}\r\nX-Long: {new string('h', 20_000)}\r\n" + filePart[(Boundary.Length + 4)..] + end), multipart), 400, null),
            ("no file part", () => Bytes(Encoding.UTF8.GetBytes(Part("description", "only words") + end), multipart), 422, "file"),
            ("an empty form", () => Bytes(Encoding.UTF8.GetBytes(end), multipart), 422, "file"),
            ("a description of 2,001 characters", () => Bytes(Encoding.UTF8.GetBytes(filePart + Part("description", new string('d', 2001)) + end), multipart), 422, "description"),
            ("a description of 60,000 characters", () => Bytes(Encoding.UTF8.GetBytes(filePart + Part("description", new string('d', 60_000)) + end), multipart), 422, "description"),
            ("two descriptions", () => Bytes(Encoding.UTF8.GetBytes(filePart + Part("description", "one") + Part("description", "two") + end), multipart), 400, "description"),
            ("a part content type of 1,000 characters", () => Bytes(Encoding.UTF8.GetBytes(Part("file", "x", "a.txt", "text/" + new string('c', 1000)) + end), multipart), 422, "contentType"),
            ("a part content type with a bidirectional override", () => Bytes(Encoding.UTF8.GetBytes(Part("file", "x", "a.txt", "text/pl\u202Eain") + end), multipart), 422, "contentType"),
            ("a file over the upload limit", () => LargeFile(EventReviewFactory.MaxUploadBytes + 1), 413, null),
        };

        foreach (var who in (string[])[Who.TokenEvidence, Who.Reviewer])
        {
            foreach (var (what, body, status, field) in cases)
            {
                yield return new CorpusRequest(endpoint, what, who, HttpMethod.Post, path) { Body = body, Expected = status, Field = field };
            }

            yield return new CorpusRequest(endpoint, "to a closed case", who, HttpMethod.Post, $"/api/cases/{t.ClosedCaseId}/items/{t.ClosedItemKey}/attachments")
            {
                Body = () => Bytes(Encoding.UTF8.GetBytes(filePart + end), multipart), Expected = 409,
            };
            yield return new CorpusRequest(endpoint, "to a case that does not exist", who, HttpMethod.Post, $"/api/cases/987654/items/{t.ItemKey}/attachments")
            {
                Body = () => Bytes(Encoding.UTF8.GetBytes(filePart + end), multipart), Expected = 404,
            };
            yield return new CorpusRequest(endpoint, "to an item that does not exist", who, HttpMethod.Post, $"/api/cases/{t.CaseId}/items/no.such.item/attachments")
            {
                Body = () => Bytes(Encoding.UTF8.GetBytes(filePart + end), multipart), Expected = 404,
            };
        }
    }

    private static MultipartFormDataContent LargeFile(long bytes)
    {
        var form = new MultipartFormDataContent();
        var part = new ByteArrayContent(new byte[bytes]);
        part.Headers.ContentType = new MediaTypeHeaderValue("application/octet-stream");
        form.Add(part, "file", "large.bin");
        return form;
    }

    private static IEnumerable<CorpusRequest> Reads(Targets t)
    {
        var lists = new (string Endpoint, string Path)[]
        {
            ("GET /api/cases", CasesPath),
            ("GET /api/cases/{id}/items/{key}/evidence", $"/api/cases/{t.CaseId}/items/{t.ItemKey}/evidence"),
            ("GET /api/cases/{id}/timeline", $"/api/cases/{t.CaseId}/timeline"),
        };
        var queries = new (string Query, int Status, string? Field)[]
        {
            ("limit=0", 422, "limit"), ("limit=-1", 422, "limit"), ("limit=501", 422, "limit"), ("limit=2147483647", 422, "limit"),
            ("limit=99999999999", 400, null), ("limit=abc", 400, null), ("limit=1e3", 400, null), ("limit=1.5", 400, null), ("limit=", 200, null),
            ("offset=-1", 422, "offset"), ("offset=-2147483648", 422, "offset"), ("offset=abc", 400, null), ("offset=1e9", 400, null), ("offset=NaN", 400, null),
            ("limit=%E2%80%AE5", 400, null),
        };
        foreach (var who in (string[])[Who.TokenRead, Who.Observer])
        {
            foreach (var (endpoint, path) in lists)
            {
                foreach (var (query, status, field) in queries.Where(q => q.Status != 200))
                {
                    yield return new CorpusRequest(endpoint, $"query {query}", who, HttpMethod.Get, $"{path}?{query}") { Expected = status, Field = field };
                }
            }

            yield return new CorpusRequest("GET /api/cases", "an unknown state", who, HttpMethod.Get, $"{CasesPath}?state=bogus") { Expected = 422, Field = "state" };
            yield return new CorpusRequest("GET /api/cases", "a state with an override", who, HttpMethod.Get, $"{CasesPath}?state={Uri.EscapeDataString("open\u202E")}") { Expected = 422, Field = "state" };
            yield return new CorpusRequest("GET /api/cases", "a search of 201 characters", who, HttpMethod.Get, $"{CasesPath}?q={new string('q', 201)}") { Expected = 422, Field = "q" };
            yield return new CorpusRequest("GET /api/cases", "a state of 5,000 characters", who, HttpMethod.Get, $"{CasesPath}?state={new string('s', 5000)}") { Expected = 422, Field = "state" };
            foreach (var id in (string[])["0", "-1", "987654", "2147483647"])
            {
                yield return new CorpusRequest("GET /api/cases/{id}", $"case id {id}", who, HttpMethod.Get, $"{CasesPath}/{id}") { Expected = 404 };
                yield return new CorpusRequest("GET /api/cases/{id}/timeline", $"case id {id}", who, HttpMethod.Get, $"{CasesPath}/{id}/timeline") { Expected = 404 };
                yield return new CorpusRequest("GET /api/cases/{id}/items/{key}/evidence", $"case id {id}", who, HttpMethod.Get, $"{CasesPath}/{id}/items/{t.ItemKey}/evidence") { Expected = 404 };
            }

            foreach (var id in (string[])["99999999999", "abc", "1.5", "%E2%80%AE1"])
            {
                yield return new CorpusRequest("GET /api/cases/{id}", $"case id '{id}' (no such route)", who, HttpMethod.Get, $"{CasesPath}/{id}") { Expected = 404 };
            }

            yield return new CorpusRequest("GET /api/cases/{id}/items/{key}/evidence", "an unknown item", who, HttpMethod.Get, $"{CasesPath}/{t.CaseId}/items/no.such.item/evidence") { Expected = 404 };
            yield return new CorpusRequest("GET /api/cases/{id}/items/{key}/evidence", "an item key of 3,000 characters", who, HttpMethod.Get, $"{CasesPath}/{t.CaseId}/items/{new string('k', 3000)}/evidence") { Expected = 404 };
            foreach (var sha in (string[])["nothex", new string('a', 63), new string('a', 65), new string('A', 64), new string('0', 64), "..%2F..%2Fetc%2Fpasswd", new string('f', 5000)])
            {
                yield return new CorpusRequest("GET /files/{sha}", $"sha '{(sha.Length > 20 ? sha[..20] + "..." : sha)}' ({sha.Length} characters)", who, HttpMethod.Get, $"/files/{sha}") { Expected = 404 };
            }

            foreach (var id in (string[])["0", "987654"])
            {
                yield return new CorpusRequest("GET /cases/{id}/dossier.zip", $"case id {id}", who, HttpMethod.Get, $"/cases/{id}/dossier.zip") { Expected = 404 };
            }

            yield return new CorpusRequest("GET /cases/{id}/dossier.zip", "case id past int", who, HttpMethod.Get, "/cases/99999999999/dossier.zip") { Expected = 404 };
            yield return new CorpusRequest("GET /api/unknown", "an unknown API path", who, HttpMethod.Get, "/api/no-such-thing") { Expected = 404 };
        }
    }
}
