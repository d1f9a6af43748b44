using Spectre.Console;

namespace SortRig.Host.Tests.Library;

/// <summary>A Spectre console writing plain text (no colour, no ANSI) into a string, 200 columns wide.</summary>
public sealed class ConsoleCapture
{
    private readonly StringWriter _writer = new();

    public ConsoleCapture()
    {
        Console = AnsiConsole.Create(
            new AnsiConsoleSettings
            {
                Out = new AnsiConsoleOutput(_writer),
                Ansi = AnsiSupport.No,
                ColorSystem = ColorSystemSupport.NoColors,
                Interactive = InteractionSupport.No,
            }
        );
        Console.Profile.Width = 200;
    }

    public IAnsiConsole Console { get; }

    /// <summary>Machine output of the verbs (labels, CSV to standard output).</summary>
    public StringWriter Stdout { get; } = new();

    public string Text => _writer.ToString();
}
