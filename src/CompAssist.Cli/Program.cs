using CompAssist.Cli;

return CliApplication.Run(args, Console.Out, Console.Error);
