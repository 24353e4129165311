using System.CommandLine;

namespace EventReview.Cli.Commands;

/// <summary>Every top-level verb of the CLI. Add one line here per new verb (one file per verb in this folder).</summary>
public static class CommandCatalog
{
    public static IEnumerable<Command> All()
    {
        yield return TimingCommand.Build();
        yield return TimeCommand.Build();
        yield return UsersCommand.Build();
        yield return TokensCommand.Build();
        yield return CasesCommand.Build();
        yield return VerifyCommand.Build();
        yield return EnvironmentCommand.Build();
        yield return SafetyCommand.Build();
        yield return SealCommand.Build();
        yield return UnsealCommand.Build();
        yield return ChainCommand.Build();
        yield return OverlapCommand.Build();
        yield return ChirpCommand.Build();
        yield return DossierCommand.Build();
        yield return ConfigCommand.Build();
        yield return SimulateCommand.Build();
        yield return BackgroundCommand.Build();
        yield return BackupCommand.Build();
        yield return RestoreCommand.Build();
        yield return KeysCommand.Build();
    }
}
