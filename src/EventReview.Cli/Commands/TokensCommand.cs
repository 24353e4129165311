using System.CommandLine;
using EventReview.Data.Auth;
using Microsoft.Extensions.DependencyInjection;

namespace EventReview.Cli.Commands;

/// <summary><c>eventreview tokens create --name N</c> (prints the secret once), <c>tokens list</c>, <c>tokens revoke --id N</c>.</summary>
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
        var create = new Command("create", "Create a token; the secret is printed once and only its hash is stored.");
        create.Options.Add(name);
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
                await using var scope = provider.CreateAsyncScope();
                var (token, secret) = await scope.ServiceProvider.GetRequiredService<AccountAdmin>().CreateTokenAsync(n, "command line");
                if (parse.GetValue(data.Json))
                {
                    CliOutput.WriteJson(new { name = token.Name, token = secret });
                }
                else
                {
                    Console.WriteLine($"Token '{token.Name}' (shown once; store it safely):");
                    Console.WriteLine(secret);
                }

                return CliOutput.Success;
            }
            catch (ArgumentException ex)
            {
                return CliOutput.Fail(ex.Message.Split(" (Parameter", 2)[0]);
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
            await using var provider = await data.OpenAsync(parse);
            await using var scope = provider.CreateAsyncScope();
            var all = await scope.ServiceProvider.GetRequiredService<AccountAdmin>().ListTokensAsync();
            if (parse.GetValue(data.Json))
            {
                CliOutput.WriteJson(all.Select(t => new { id = t.Id, name = t.Name, createdAt = t.CreatedAt, lastUsedAt = t.LastUsedAt, revokedAt = t.RevokedAt }));
            }
            else
            {
                foreach (var t in all)
                {
                    Console.WriteLine($"{t.Id,4} {t.Name,-30} created {t.CreatedAt:yyyy-MM-dd HH:mm} {(t.RevokedAt is null ? "active" : "revoked")}");
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
