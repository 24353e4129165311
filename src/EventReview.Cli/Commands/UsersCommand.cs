using System.CommandLine;
using EventReview.Data.Auth;
using Microsoft.Extensions.DependencyInjection;
using EventReview.Core.Inputs;

namespace EventReview.Cli.Commands;

/// <summary><c>eventreview users add --email E --role R [--password P] [--name N]</c> and <c>users list</c>.</summary>
public static class UsersCommand
{
    public static Command Build()
    {
        var users = new Command("users", "Manage local accounts.");
        users.Subcommands.Add(BuildAdd());
        users.Subcommands.Add(BuildList());
        return users;
    }

    private static Command BuildAdd()
    {
        var data = new DataOptions();
        var email = new Option<string>("--email") { Description = "Email address (the sign-in name)." };
        var role = new Option<string>("--role") { Description = "coordinator, reviewer or observer." };
        var password = new Option<string>("--password") { Description = "Password; one is generated and printed when omitted." };
        var name = new Option<string>("--name") { Description = "Printed name used on sign-offs (default: the part of the email before @)." };
        var add = new Command("add", "Create an account.");
        add.Options.Add(email);
        add.Options.Add(role);
        add.Options.Add(password);
        add.Options.Add(name);
        data.AddTo(add);
        add.SetAction(async (parse, ct) =>
        {
            var e = parse.GetValue(email);
            var r = parse.GetValue(role);
            if (string.IsNullOrWhiteSpace(e) || string.IsNullOrWhiteSpace(r))
            {
                return CliOutput.Fail("--email and --role are required.");
            }

            try
            {
                await using var provider = await data.OpenAsync(parse);
                await using var scope = provider.CreateAsyncScope();
                var admin = scope.ServiceProvider.GetRequiredService<AccountAdmin>();
                var (user, pw, generated) = await admin.CreateUserAsync(e, r.Trim().ToLowerInvariant(), parse.GetValue(password), parse.GetValue(name));
                if (parse.GetValue(data.Json))
                {
                    CliOutput.WriteJson(new { id = user.Id, email = user.Email, role = r.Trim().ToLowerInvariant(), displayName = user.DisplayName, password = generated ? pw : null });
                }
                else
                {
                    Console.WriteLine($"Created {user.Email} ({user.DisplayName}) as {r}.");
                    if (generated)
                    {
                        Console.WriteLine($"Password (shown once): {pw}");
                    }
                }

                return CliOutput.Success;
            }
            catch (ArgumentException ex)
            {
                return CliOutput.Fail(UserMessage.From(ex));
            }
        });
        return add;
    }

    private static Command BuildList()
    {
        var data = new DataOptions();
        var list = new Command("list", "List accounts and roles.");
        data.AddTo(list);
        list.SetAction(async (parse, ct) =>
        {
            try
            {
                await using var provider = await data.OpenAsync(parse, writes: false);
                await using var scope = provider.CreateAsyncScope();
                var all = await scope.ServiceProvider.GetRequiredService<AccountAdmin>().ListUsersAsync();
                if (parse.GetValue(data.Json))
                {
                    CliOutput.WriteJson(all.Select(u => new { id = u.User.Id, email = u.User.Email, displayName = u.User.DisplayName, role = u.Role }));
                }
                else
                {
                    foreach (var (u, role) in all)
                    {
                        Console.WriteLine($"{u.Email,-40} {role,-12} {u.DisplayName}");
                    }
                }

                return CliOutput.Success;
            }
            catch (ArgumentException ex)
            {
                return CliOutput.Fail(UserMessage.From(ex));
            }
        });
        return list;
    }
}
