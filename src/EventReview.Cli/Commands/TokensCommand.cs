using System.CommandLine;
using EventReview.Data.Auth;
using Microsoft.Extensions.DependencyInjection;
using EventReview.Core.Inputs;

namespace EventReview.Cli.Commands;

/// <summary>
/// <c>eventreview tokens create --name N [--scope S]... [--expires-in-days D]</c> (prints the secret once),
/// <c>tokens list</c> (scopes, expiry, state), <c>tokens revoke --id N</c>.
/// </summary>
public static class TokensCommand
{
    public static Command Build()
    {
        var tokens = new Command("tokens", "Manage API tokens for search pipelines.");
        tokens.Subcommands.Add(BuildCreate());
        tokens.Subcommands.Add(BuildList());
        tokens.Subcommands.Add(BuildRevoke());
        return tokens;
    }

    private static Command BuildCreate()
    {
        var data = new DataOptions();
        var name = new Option<string>("--name") { Description = "What the token is for (e.g. the pipeline's name)." };
        var scope = new Option<string[]>("--scope")
        {
            Description = $"What the token may do; repeat or give a comma list of {string.Join(", ", TokenScopes.All)} (default: {string.Join(",", TokenScopes.Pipeline)}, what a pipeline needs).",
            AllowMultipleArgumentsPerToken = true,
        };
        var expires = new Option<int?>("--expires-in-days") { Description = $"Days until the token stops working (1-{ApiToken.MaxLifetimeDays}; default {ApiToken.DefaultLifetimeDays})." };
        var create = new Command("create", "Create a token; the secret is printed once and only its hash is stored.");
        create.Options.Add(name);
        create.Options.Add(scope);
        create.Options.Add(expires);
        data.AddTo(create);
        create.SetAction(async (parse, ct) =>
        {
            var n = parse.GetValue(name);
            if (string.IsNullOrWhiteSpace(n))
            {
                return CliOutput.Fail("--name is required.");
            }

            try
            {
                await using var provider = await data.OpenAsync(parse);
                await using var services = provider.CreateAsyncScope();
                var (token, secret) = await services.ServiceProvider.GetRequiredService<AccountAdmin>()
                    .CreateTokenAsync(n, "command line", parse.GetValue(scope), parse.GetValue(expires));
                if (parse.GetValue(data.Json))
                {
                    CliOutput.WriteJson(new { id = token.Id, name = token.Name, token = secret, scopes = token.ScopeList, expiresAt = token.ExpiresAt });
                }
                else
                {
                    Console.WriteLine($"Token '{token.Name}' (id {token.Id}; scopes {string.Join(", ", token.ScopeList)}; expires {token.ExpiresAt:yyyy-MM-dd HH:mm} UTC). Shown once; store it safely:");
                    Console.WriteLine(secret);
                }

                return CliOutput.Success;
            }
            catch (ArgumentException ex)
            {
                return CliOutput.Fail(UserMessage.From(ex).ReplaceLineEndings(" "));
            }
        });
        return create;
    }

    private static Command BuildList()
    {
        var data = new DataOptions();
        var list = new Command("list", "List tokens (never their secrets).");
        data.AddTo(list);
        list.SetAction(async (parse, ct) =>
        {
            await using var provider = await data.OpenAsync(parse, writes: false);
            await using var scope = provider.CreateAsyncScope();
            var all = await scope.ServiceProvider.GetRequiredService<AccountAdmin>().ListTokensAsync();
            var now = scope.ServiceProvider.GetRequiredService<TimeProvider>().GetUtcNow();
            if (parse.GetValue(data.Json))
            {
                CliOutput.WriteJson(all.Select(t => new
                {
                    id = t.Id, name = t.Name, scopes = t.ScopeList, createdAt = t.CreatedAt, expiresAt = t.ExpiresAt, lastUsedAt = t.LastUsedAt,
                    revokedAt = t.RevokedAt, state = t.StateAt(now).ToString().ToLowerInvariant(),
                }));
            }
            else
            {
                foreach (var t in all)
                {
                    Console.WriteLine($"{t.Id,4} {t.Name,-30} {t.StateAt(now).ToString().ToLowerInvariant(),-8} expires {t.ExpiresAt:yyyy-MM-dd} scopes {string.Join(",", t.ScopeList)}");
                }
            }

            return CliOutput.Success;
        });
        return list;
    }

    private static Command BuildRevoke()
    {
        var data = new DataOptions();
        var id = new Option<int?>("--id") { Description = "Token id (from tokens list)." };
        var revoke = new Command("revoke", "Revoke a token.");
        revoke.Options.Add(id);
        data.AddTo(revoke);
        revoke.SetAction(async (parse, ct) =>
        {
            if (parse.GetValue(id) is not { } tokenId)
            {
                return CliOutput.Fail("--id is required.");
            }

            try
            {
                await using var provider = await data.OpenAsync(parse);
                await using var scope = provider.CreateAsyncScope();
                await scope.ServiceProvider.GetRequiredService<AccountAdmin>().RevokeTokenAsync(tokenId);
                Console.WriteLine($"Token {tokenId} revoked.");
                return CliOutput.Success;
            }
            catch (KeyNotFoundException ex)
            {
                return CliOutput.Fail(ex.Message);
            }
        });
        return revoke;
    }
}
