if (args.Length > 0 && args[0] == "fit") { Tessel.Benchmarks.FitBenchmark.Run(args[1..]); return; }
Console.WriteLine("benchmarks: none yet");
