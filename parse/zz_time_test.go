package parse
import ("testing";"github.com/alecthomas/participle/v2")
func BenchmarkZZBuild(b *testing.B){
 tk := tokens()
 for i:=0;i<b.N;i++{ participle.MustBuild[statement](participle.Lexer(tk), participle.Elide("Space"), participle.UseLookahead(2)) }
}
