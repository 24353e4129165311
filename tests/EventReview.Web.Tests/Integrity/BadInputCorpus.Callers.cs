using System.Text;
using EventReview.Web.Tests.Fixtures;

namespace EventReview.Web.Tests.Integrity;

/// <summary>The corpus, continued: callers who may not, writes from other origins, unsupported methods, the sign-in form.</summary>
public static partial class BadInputCorpus
{
    /// <summary>Every endpoint with a request that would succeed for the right caller.</summary>
    private static IEnumerable<(string Endpoint, HttpMethod Method, string Path, Func<HttpContent?> Body, string Scope)> Endpoints(Targets t)
    {
        var note = $"/api/cases/{t.CaseId}/items/{t.ItemKey}/notes";
        var attach = $"/api/cases/{t.CaseId}/items/{t.ItemKey}/attachments";
        yield return ("POST /api/cases", HttpMethod.Post, CasesPath, () => ApiCalls.Json(ValidCase().ToJsonString()), "cases:open");
        yield return ("POST /api/cases/{id}/items/{key}/notes", HttpMethod.Post, note, () => ApiCalls.Json("{\"text\": \"corpus\"}"), "evidence:add");
        yield return ("POST /api/cases/{id}/items/{key}/attachments", HttpMethod.Post, attach, () => LargeFile(10), "evidence:add");
        yield return ("GET /api/cases", HttpMethod.Get, CasesPath, () => null, "cases:read");
        yield return ("GET /api/cases/{id}", HttpMethod.Get, $"{CasesPath}/{t.CaseId}", () => null, "cases:read");
        yield return ("GET /api/cases/{id}/items/{key}/evidence", HttpMethod.Get, $"{CasesPath}/{t.CaseId}/items/{t.ItemKey}/evidence", () => null, "cases:read");
        yield return ("GET /api/cases/{id}/timeline", HttpMethod.Get, $"{CasesPath}/{t.CaseId}/timeline", () => null, "cases:read");
        yield return ("GET /api/sites", HttpMethod.Get, "/api/sites", () => null, "cases:read");
        yield return ("GET /api/cases/{id}/items/{key}/computations", HttpMethod.Get, $"{CasesPath}/{t.CaseId}/items/{t.ItemKey}/computations", () => null, "cases:read");
        yield return ("GET /api/cases/{id}/items/{key}/signoffs", HttpMethod.Get, $"{CasesPath}/{t.CaseId}/items/{t.ItemKey}/signoffs", () => null, "cases:read");
        yield return ("GET /files/{sha}", HttpMethod.Get, $"/files/{new string('0', 64)}", () => null, "cases:read");
        yield return ("GET /cases/{id}/dossier.zip", HttpMethod.Get, $"/cases/{t.CaseId}/dossier.zip", () => null, "cases:read");
        yield return ("GET /network.json", HttpMethod.Get, "/network.json", () => null, "cases:read");
    }

    private static IEnumerable<CorpusRequest> Refused(Targets t)
    {
        var bearers = new (string What, string Header)[]
        {
            ("an unknown token", "Bearer ert_" + new string('x', 40)), ("a token without the prefix", "Bearer not-a-token"),
            ("a token of 5,000 characters", "Bearer ert_" + new string('y', 5000)), ("a token with spaces", "Bearer ert_abc def"),
            ("a lower-case scheme with junk", "bearer %%%"),
        };
        foreach (var (endpoint, method, path, body, scope) in Endpoints(t))
        {
            foreach (var who in (string[])[Who.TokenExpired, Who.TokenRevoked])
            {
                yield return new CorpusRequest(endpoint, "refused token", who, method, path) { Body = body, Expected = 401 };
            }

            foreach (var (what, header) in bearers)
            {
                yield return new CorpusRequest(endpoint, what, Who.Anonymous, method, path)
                {
                    Body = body, Expected = 401, Headers = [new("Authorization", header)],
                };
            }

            var wrongScope = scope switch { "cases:read" => Who.TokenOpen, "cases:open" => Who.TokenEvidence, _ => Who.TokenRead };
            yield return new CorpusRequest(endpoint, $"a token without {scope}", wrongScope, method, path) { Body = body, Expected = 403 };
            if (path.StartsWith("/api", StringComparison.Ordinal) || path.StartsWith("/openapi", StringComparison.Ordinal))
            {
                yield return new CorpusRequest(endpoint, "no sign-in and no token", Who.Anonymous, method, path) { Body = body, Expected = 401 };
            }

            if (method == HttpMethod.Post)
            {
                yield return new CorpusRequest(endpoint, "an observer's cookie", Who.Observer, method, path) { Body = body, Expected = 403 };
            }
        }
    }

    private static IEnumerable<CorpusRequest> CrossOrigin(Targets t)
    {
        var origins = new (string What, string Origin)[]
        {
            ("another port of the same host", "http://localhost:8081"), ("another host", "https://evil.example"), ("https of the same host", "https://localhost"),
            ("a sub-domain", "http://tools.localhost"), ("the opaque origin null", "null"), ("a malformed origin", "http://"),
            ("an origin with a path", "http://localhost/cases"), ("an origin with user info", "http://user@localhost"),
        };
        foreach (var (endpoint, method, path, body, _) in Endpoints(t).Where(e => e.Method == HttpMethod.Post))
        {
            var who = endpoint == "POST /api/cases" ? Who.Coordinator : Who.Reviewer;
            foreach (var (what, origin) in origins)
            {
                yield return new CorpusRequest(endpoint, $"cookie write from {what}", who, method, path)
                {
                    Body = body, Expected = 403, Headers = [new("Origin", origin)],
                };
            }

            yield return new CorpusRequest(endpoint, "cookie write without Origin or antiforgery token", CorpusRequest.CookieWithoutOrigin, method, path) { Body = body, Expected = 403 };
            yield return new CorpusRequest(endpoint, "cookie write with a forged antiforgery token", CorpusRequest.CookieWithoutOrigin, method, path)
            {
                Body = body, Expected = 403, Headers = [new("RequestVerificationToken", "CfDJ8forged")],
            };
        }
    }

    private static IEnumerable<CorpusRequest> Methods(Targets t)
    {
        var paths = new (string Endpoint, string Path)[]
        {
            ("POST /api/cases", CasesPath), ("GET /api/cases/{id}", $"{CasesPath}/{t.CaseId}"), ("GET /api/sites", "/api/sites"),
            ("POST /api/cases/{id}/items/{key}/notes", $"{CasesPath}/{t.CaseId}/items/{t.ItemKey}/notes"), ("GET /network.json", "/network.json"),
            ("GET /api/cases/{id}/timeline", $"{CasesPath}/{t.CaseId}/timeline"),
        };
        foreach (var (endpoint, path) in paths)
        {
            foreach (var method in (HttpMethod[])[HttpMethod.Put, HttpMethod.Delete, HttpMethod.Patch])
            {
                foreach (var who in (string[])[Who.Token, Who.Coordinator])
                {
                    yield return new CorpusRequest(endpoint, $"method {method}", who, method, path) { Body = () => ApiCalls.Json("{}"), Expected = 405 };
                }
            }
        }
    }

    private static IEnumerable<CorpusRequest> SignIn(Targets t)
    {
        const string endpoint = "POST /account/signin";
        Dictionary<string, string> Form(string returnUrl, string? email = null, string? password = null) => new()
        {
            ["email"] = email ?? t.SignInEmail, ["password"] = password ?? t.SignInPassword, ["returnUrl"] = returnUrl,
        };

        var hostile = new[]
        {
            "/\t/evil.example", "//evil.example", "/\\evil.example", "https://evil.example", "http:evil.example", "\t/evil.example", " /evil.example",
            "/\r\n/evil.example", "/\n/evil.example", "/\u202E/evil.example", "/\u200B/evil.example", "javascript:alert(1)", "/\\/evil.example",
            "///evil.example", "~/evil", "/" + new string('a', 5000), "%2F%2Fevil.example", "/\t\t/evil.example", "\\\\evil.example",
            "/ /evil.example", "data:text/html,hi", "/\u3000/evil.example", "/\uFEFF/evil.example",
        };
        foreach (var url in hostile)
        {
            yield return new CorpusRequest(endpoint, $"returnUrl {Printable(url)}", Who.Anonymous, HttpMethod.Post, "/account/signin")
            {
                SignInForm = Form(url), Expected = 302, AuditsSignIn = true,
            };
        }

        yield return new CorpusRequest(endpoint, "a wrong password with a hostile returnUrl", Who.Anonymous, HttpMethod.Post, "/account/signin")
        {
            SignInForm = Form("/\t/evil.example", "nobody-" + Guid.NewGuid().ToString("N")[..8] + "@example.org", "Wrong-password-1"), Expected = 302, AuditsSignIn = true,
        };
        yield return new CorpusRequest(endpoint, "a password of 100,000 characters", Who.Anonymous, HttpMethod.Post, "/account/signin") { SignInForm = Form("/cases", password: new string('p', 100_000)), Expected = 302 };
        yield return new CorpusRequest(endpoint, "an email of 10,000 characters", Who.Anonymous, HttpMethod.Post, "/account/signin") { SignInForm = Form("/cases", email: new string('e', 10_000) + "@example.org"), Expected = 302 };
        yield return new CorpusRequest(endpoint, "no antiforgery token", Who.Anonymous, HttpMethod.Post, "/account/signin") { SignInForm = Form("/cases"), WithoutToken = true, Expected = 400 };
        yield return new CorpusRequest(endpoint, "a forged antiforgery token", Who.Anonymous, HttpMethod.Post, "/account/signin")
        {
            SignInForm = new Dictionary<string, string>(Form("/cases")) { ["__RequestVerificationToken"] = "CfDJ8forged" }, WithoutToken = true, Expected = 400,
        };
        yield return new CorpusRequest(endpoint, "a JSON body", Who.Anonymous, HttpMethod.Post, "/account/signin") { Body = () => ApiCalls.Json("{\"email\": \"x\"}"), Expected = 415 };
        yield return new CorpusRequest(endpoint, "no body", Who.Anonymous, HttpMethod.Post, "/account/signin") { Expected = 400 };
        yield return new CorpusRequest(endpoint, "a NUL in the returnUrl", Who.Anonymous, HttpMethod.Post, "/account/signin") { SignInForm = Form("/cases\u0000/x"), Expected = 400 };
        yield return new CorpusRequest(endpoint, "multipart without a boundary", Who.Anonymous, HttpMethod.Post, "/account/signin")
        {
            Body = () => Bytes("--x\r\n\r\n"u8.ToArray(), "multipart/form-data"), Expected = 400,
        };
        yield return new CorpusRequest(endpoint, "a form of 5,000 fields", Who.Anonymous, HttpMethod.Post, "/account/signin")
        {
            Body = () => Bytes(Encoding.UTF8.GetBytes(string.Join('&', Enumerable.Range(0, 5000).Select(i => $"f{i}=v"))), "application/x-www-form-urlencoded"), Expected = 400,
        };
        yield return new CorpusRequest(endpoint, "from another origin", Who.Anonymous, HttpMethod.Post, "/account/signin")
        {
            SignInForm = Form("/cases"), Expected = 403, Headers = [new("Origin", "http://localhost:8081")],
        };
        yield return new CorpusRequest("POST /account/signout", "no antiforgery token", Who.Reviewer, HttpMethod.Post, "/account/signout")
        {
            Body = () => new FormUrlEncodedContent([]), Expected = 400,
        };
        yield return new CorpusRequest("POST /account/signout", "from another origin", Who.Reviewer, HttpMethod.Post, "/account/signout")
        {
            Body = () => new FormUrlEncodedContent([]), Expected = 403, Headers = [new("Origin", "https://evil.example")],
        };
    }

    private static string Printable(string s)
    {
        var shown = string.Concat(s.Select(c => char.IsControl(c) || char.IsWhiteSpace(c) || char.GetUnicodeCategory(c) == System.Globalization.UnicodeCategory.Format ? $"\\u{(int)c:X4}" : c.ToString()));
        return shown.Length > 40 ? shown[..40] + "..." : shown;
    }
}
