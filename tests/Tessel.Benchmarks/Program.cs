Console.WriteLine("benchmarks: none yet");
