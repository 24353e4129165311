using System.Net;
using System.Text.Json;
using System.Text.Json.Nodes;
using EventReview.Data.Auth;
using EventReview.Web.Tests.Fixtures;
using Microsoft.Extensions.DependencyInjection;

namespace EventReview.Web.Tests.Integrity;

/// <summary>
/// Sends the whole bad-input corpus (<see cref="BadInputCorpus"/>, over 500 requests across every endpoint and the
/// sign-in form) to one app and checks, after every request: no 5xx; every error answer is an RFC 9457 problem with a
/// title and a detail (a 422 names its field); the status is the one the case pins; and nothing changed - row counts
/// of every table, every case's chain head, the sign-in audit head and the files of the data folder are as before.
/// </summary>
public sealed class BadInputCorpusTests(EventReviewFactory app) : IClassFixture<EventReviewFactory>
{
    private const string SignInPassword = "Corpus-Sign-In-Passphrase-31";

    private async Task<BadInputCorpus.Targets> TargetsAsync()
    {
        var coordinator = await app.As(Who.Coordinator);
        var open = await coordinator.CaseIdAsync("ER-C-0142");
        var closed = await coordinator.CaseIdAsync("ER-C-0121");
        var closedDetail = await (await coordinator.GetAsync($"/api/cases/{closed}")).JsonAsync();
        Assert.Equal("closed", (string?)closedDetail["state"]);
        var email = $"corpus-{Guid.NewGuid():N}"[..16] + "@example.org";
        using (var scope = app.Services.CreateScope())
        {
            await scope.ServiceProvider.GetRequiredService<AccountAdmin>().CreateUserAsync(email, Roles.Observer, SignInPassword, "Corpus Caller");
        }

        return new(open, "timing.arrival", closed, (string)closedDetail["items"]![0]!["key"]!, email, SignInPassword);
    }

    [Fact]
    public async Task The_corpus_holds_over_500_requests_and_reaches_every_endpoint()
    {
        var corpus = BadInputCorpus.All(new(1, "timing.arrival", 2, "triage.state", "x@example.org", "x"));

        Assert.True(corpus.Count >= 500, $"{corpus.Count} requests");
        string[] endpoints =
        [
            "POST /api/cases", "GET /api/cases", "GET /api/cases/{id}", "GET /api/cases/{id}/items/{key}/evidence", "GET /api/cases/{id}/timeline",
            "GET /api/sites", "POST /api/cases/{id}/items/{key}/notes", "POST /api/cases/{id}/items/{key}/attachments", "GET /files/{sha}",
            "GET /cases/{id}/dossier.zip", "GET /network.json", "GET /api/cases/{id}/items/{key}/computations", "GET /api/cases/{id}/items/{key}/signoffs",
            "POST /account/signin", "POST /account/signout",
        ];
        Assert.Empty(endpoints.Except(corpus.Select(r => r.Endpoint)));
        Assert.Empty(corpus.GroupBy(r => r.ToString()).Where(g => g.Count() > 1).Select(g => g.Key));
    }

    [Fact]
    public async Task Every_request_of_the_corpus_is_refused_with_a_problem_and_changes_nothing()
    {
        var targets = await TargetsAsync();
        var corpus = BadInputCorpus.All(targets);
        var clients = new Dictionary<string, HttpClient>();
        foreach (var who in corpus.Select(r => r.Who).Distinct())
        {
            clients[who] = who == CorpusRequest.CookieWithoutOrigin ? await WithoutOriginAsync() : await app.As(who);
        }

        var failures = new List<string>();
        var statuses = new Dictionary<int, int>();
        var before = await StoreSnapshot.TakeAsync(app);
        foreach (var request in corpus)
        {
            var unaudited = request.AuditsSignIn ? await StoreSnapshot.TakeAsync(app, [StoreSnapshot.AccountEvents]) : null;
            var (status, problem, location) = await SendAsync(clients[request.Who], request);
            statuses[status] = statuses.GetValueOrDefault(status) + 1;
            failures.AddRange(Check(request, status, problem, location).Select(f => $"{request}: {f}"));
            if (unaudited is not null)
            {
                // A sign-in attempt is recorded in the audit by design; nothing else may change.
                if (await StoreSnapshot.TakeAsync(app, [StoreSnapshot.AccountEvents]) != unaudited)
                {
                    failures.Add($"{request}: changed more than the sign-in audit");
                }

                before = await StoreSnapshot.TakeAsync(app);
                continue;
            }

            var after = await StoreSnapshot.TakeAsync(app);
            if (after != before)
            {
                failures.Add($"{request}: changed the store ({string.Join("; ", after.Split('\n').Except(before.Split('\n')).Take(3))})");
                before = after;
            }
        }

        Assert.True(failures.Count == 0, $"{failures.Count} of {corpus.Count} requests failed (statuses {string.Join(", ", statuses.OrderBy(s => s.Key).Select(s => $"{s.Key}×{s.Value}"))}):\n" +
            string.Join('\n', failures.Take(40)));
        Assert.DoesNotContain(statuses.Keys, s => s >= 500);
    }

    private static IEnumerable<string> Check(CorpusRequest request, int status, JsonNode? problem, string? location)
    {
        if (status >= 500)
        {
            yield return $"answered {status}";
        }

        // A redirect (the sign-in form's answer) only ever to a path of this app.
        if (location is not null && !(location.StartsWith('/') && !location.StartsWith("//", StringComparison.Ordinal) &&
                                      !location.Contains('\\', StringComparison.Ordinal) && !location.Any(c => char.IsControl(c) || char.IsWhiteSpace(c))))
        {
            yield return $"redirects to '{location}', not to a path of the app";
        }

        if (request.Expected is { } expected && status != expected)
        {
            yield return $"answered {status}, expected {expected} ({(string?)problem?["detail"]})";
        }

        if (status >= 400)
        {
            if (problem is null)
            {
                yield return $"answered {status} without an application/problem+json body";
                yield break;
            }

            if ((int?)problem["status"] != status || string.IsNullOrWhiteSpace((string?)problem["title"]) || string.IsNullOrWhiteSpace((string?)problem["detail"]))
            {
                yield return $"problem body lacks status, title or detail: {problem.ToJsonString()}";
            }

            if (request.Field is { } field && status is 400 or 422 && (string?)problem["field"] != field)
            {
                yield return $"problem names field '{(string?)problem["field"]}', expected '{field}' ({(string?)problem["detail"]})";
            }

            if (status == 422 && string.IsNullOrEmpty((string?)problem["field"]))
            {
                yield return "a 422 without the field it refuses";
            }
        }
    }

    private async Task<(int Status, JsonNode? Problem, string? Location)> SendAsync(HttpClient client, CorpusRequest request)
    {
        using var message = new HttpRequestMessage(request.Method, request.Path) { Content = request.Body() };
        if (request.SignInForm is { } form)
        {
            // A fresh browser per sign-in: its own antiforgery cookie and token, from the sign-in page.
            client = app.Anonymous();
            var fields = new Dictionary<string, string>(form);
            if (!request.WithoutToken)
            {
                fields["__RequestVerificationToken"] = await EventReviewFactory.AntiforgeryTokenAsync(client);
            }

            message.Content = new FormUrlEncodedContent(fields);
        }

        foreach (var (name, value) in request.Headers)
        {
            message.Headers.Remove(name);
            message.Headers.TryAddWithoutValidation(name, value);
        }

        using var response = await client.SendAsync(message);
        var status = (int)response.StatusCode;
        if (status is >= 300 and < 400)
        {
            return (status, null, response.Headers.Location?.OriginalString ?? string.Empty);
        }

        if (response.Content.Headers.ContentType?.MediaType != "application/problem+json")
        {
            return (status, null, null);
        }

        try
        {
            return (status, JsonNode.Parse(await response.Content.ReadAsStringAsync()), null);
        }
        catch (JsonException)
        {
            return (status, null, null);
        }
    }

    private async Task<HttpClient> WithoutOriginAsync()
    {
        var client = await app.SignedInClientAsync(EventReviewFactory.AccountFor(Who.Coordinator));
        client.DefaultRequestHeaders.Remove("Origin");
        return client;
    }
}
