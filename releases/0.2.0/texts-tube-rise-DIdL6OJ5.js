Wickstone._d("0.2.0/texts-tube-rise-DIdL6OJ5.js",function($wkr){const{l:e,n:t,o:n,r,s:i,t:a}=$wkr("shared-texts-eg4Lld6Y.js");;var o={cautions:[r,a,t],references:[{id:`jurin-1718`,citation:`Jurin J. (1718) An account of some experiments shown before the Royal Society, Phil. Trans. 30, 739–747`,usedFor:`Jurin's law, h = 4σ cos θ/(ρ g d)`,basis:`printed`},i,...e,...n]};return{"texts":o}
});
