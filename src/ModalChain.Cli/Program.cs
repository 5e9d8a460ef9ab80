using ModalChain.Cli;

// Standard output as bytes too, so JSON results are streamed to it as they are written.
using var stdout = Console.OpenStandardOutput();
return CliApp.Run(args, Console.Out, Console.Error, stdout);
