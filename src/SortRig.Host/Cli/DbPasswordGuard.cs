using System.CommandLine;
using SortRig.Storage.Lab;

namespace SortRig.Host.Cli;

/// <summary>
/// Refuses a password inside --db on any verb: the command line is in the process list for every user of the
/// machine and in shell history. The password goes in PGPASSWORD, a passfile, SORTRIG_Sort__Database or
/// appsettings.json instead (docs/lab.md).
/// </summary>
internal static class DbPasswordGuard
{
    public const string Message =
        "--db: the connection string holds a password, which the process list would show to every user; "
        + "leave it out and set PGPASSWORD, a passfile (Passfile=/path or ~/.pgpass) or SORTRIG_Sort__Database "
        + "instead (docs/lab.md)";

    /// <summary>Adds the check to every --db option of <paramref name="command"/> and its subcommands.</summary>
    public static void Attach(Command command)
    {
        foreach (var option in command.Options.Where(o => o.Name == "--db"))
        {
            option.Validators.Add(result =>
            {
                if (result.Tokens.Any(t => ConnectionText.HasPassword(t.Value)))
                {
                    result.AddError(Message);
                }
            });
        }

        foreach (var sub in command.Subcommands)
        {
            Attach(sub);
        }
    }
}
